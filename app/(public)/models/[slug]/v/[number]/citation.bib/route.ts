/** BibTeX entry of the version, with its specification hash. */
import { toBibtex } from "@/lib/citation";
import { citationOf } from "@/lib/registry";
import { downloadRoute, fileStem } from "../download";

export const dynamic = "force-dynamic";

export const GET = downloadRoute((p) => ({
  body: toBibtex(citationOf(p)),
  mediaType: "application/x-bibtex; charset=utf-8",
  fileName: `${fileStem(p)}.bib`,
}));
