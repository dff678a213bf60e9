/** The server's stored report of the version (restpoint/report@1). */
import { downloadRoute, fileStem, NotFound } from "../download";

export const dynamic = "force-dynamic";

export const GET = downloadRoute((p) => {
  if (p.report === null) throw new NotFound("report", "This version has not been re-run yet, so there is no report.");
  return {
    body: `${JSON.stringify(p.report, null, 2)}\n`,
    mediaType: "application/json; charset=utf-8",
    fileName: `${fileStem(p)}-report.json`,
  };
});
