import { LoadingBlocks } from "@/components/ui/Loading";

export default function Loading() {
  return <LoadingBlocks label="Loading" />;
}
