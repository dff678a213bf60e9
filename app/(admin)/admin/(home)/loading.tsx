// Kept in a route group of its own: a loading boundary above pages that answer 403/404 would
// start streaming first and turn those answers into 200.
import { LoadingBlocks } from "@/components/ui/Loading";

export default function Loading() {
  return <LoadingBlocks label="Loading" />;
}
