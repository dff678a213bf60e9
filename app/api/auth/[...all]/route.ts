/** better-auth's HTTP endpoints (/api/auth/sign-in/email, /api/auth/verify-email, ...). */
import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/lib/auth";

export const { GET, POST } = toNextJsHandler(auth);
