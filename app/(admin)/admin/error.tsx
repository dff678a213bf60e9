"use client";
import { AreaError } from "@/components/ui/AreaError";

export default function AdminError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <AreaError title="This administration page could not be loaded." {...props} />;
}
