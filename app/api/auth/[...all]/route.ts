import { CLIENT_ADDRESS_HEADER, getAuth } from "@/lib/server/auth";
import { clientAddress, UNKNOWN_ADDRESS } from "@/lib/server/client-address";

/** better-auth's handler, told the client address we trust (never the one a client claims). */
async function handle(request: Request) {
  const headers = new Headers(request.headers);
  headers.delete(CLIENT_ADDRESS_HEADER);
  const address = clientAddress(request.headers);
  if (address !== UNKNOWN_ADDRESS) headers.set(CLIENT_ADDRESS_HEADER, address);
  return (await getAuth()).handler(new Request(request, { headers }));
}

export const GET = handle;
export const POST = handle;
