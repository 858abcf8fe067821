import { getAuth } from "@/lib/server/auth";

async function handle(request: Request) {
  return (await getAuth()).handler(request);
}

export const GET = handle;
export const POST = handle;
