"use client";
import { AreaError } from "@/components/ui/AreaError";

export default function WorkspaceError(props: { error: Error & { digest?: string }; reset: () => void }) {
  return <AreaError title="This part of your workspace could not be loaded." {...props} />;
}
