import { PageSkeleton } from "@/app/_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton what="the award sign-off" panels={2} />;
}
