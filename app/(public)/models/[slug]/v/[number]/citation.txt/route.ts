/** Plain-text citation of the version, with its specification hash. */
import { toPlainText } from "@/lib/citation";
import { citationOf } from "@/lib/registry";
import { downloadRoute, fileStem } from "../download";

export const dynamic = "force-dynamic";

export const GET = downloadRoute((p) => ({
  body: toPlainText(citationOf(p)),
  mediaType: "text/plain; charset=utf-8",
  fileName: `${fileStem(p)}-citation.txt`,
}));
