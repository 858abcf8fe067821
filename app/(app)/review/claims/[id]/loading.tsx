import { PageSkeleton } from "@/app/_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton what="the claim, its limits and its lab runs" rows={5} panels={2} />;
}
