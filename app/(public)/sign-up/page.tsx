import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { FormCard } from "@/components/layout/Shell";
import { getActor } from "@/lib/authz";
import { env } from "@/lib/env";
import { SignUpForm } from "./SignUpForm";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage() {
  if ((await getActor()) !== null) redirect("/workspace");
  return (
    <FormCard
      title="Create an account"
      lede={
        <>
          Every new account starts as an author: you can deposit models and follow their reports. Already registered?{" "}
          <Link href="/sign-in" className="rp-link">
            Sign in
          </Link>
          .
        </>
      }
    >
      <SignUpForm capturedMail={env.useFakeSmtp} />
    </FormCard>
  );
}
