import { PageSkeleton } from "@/app/_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton what="the comparison of the offers" rows={6} panels={2} />;
}
