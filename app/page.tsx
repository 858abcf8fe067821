import { redirect } from "next/navigation";
import { getViewer } from "@/lib/server/session";

export default async function Home() {
  redirect((await getViewer()) ? "/desk" : "/sign-in");
}
