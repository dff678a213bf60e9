import type { Metadata } from "next";
import Link from "next/link";
import { FormCard } from "@/components/layout/Shell";
import { ForgotPasswordForm } from "./ForgotPasswordForm";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <FormCard
      title="Forgot your password?"
      lede={
        <>
          We will send a link for choosing a new one. Remembered it?{" "}
          <Link href="/sign-in" className="rp-link">
            Sign in
          </Link>
          .
        </>
      }
    >
      <ForgotPasswordForm />
    </FormCard>
  );
}
