/** The version's specification exactly as it was uploaded. */
import { downloadRoute, fileStem } from "../download";

export const dynamic = "force-dynamic";

export const GET = downloadRoute((p) => ({
  body: p.specText,
  mediaType: "application/json; charset=utf-8",
  fileName: `${fileStem(p)}-spec.json`,
}));
