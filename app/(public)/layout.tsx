import { Shell } from "@/components/layout/Shell";

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return <Shell>{children}</Shell>;
}
