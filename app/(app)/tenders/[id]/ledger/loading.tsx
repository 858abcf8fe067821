import { PageSkeleton } from "@/app/_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton what="the tender's ledger and its check" rows={8} />;
}
