import { describe, expect, it } from "vitest";
import { toSearch, type QueueControls } from "@/components/editor/QueueTable";
import { parseQueueQuery } from "@/lib/queue";

const plain: QueueControls = {
  status: [],
  verdict: [],
  q: "",
  author: "",
  version: "",
  minContradicted: "",
  submittedFrom: "",
  submittedTo: "",
  sort: "submitted",
  dir: "desc",
  page: 1,
  pageSize: 25,
};

describe("toSearch", () => {
  it("leaves defaults out of the address, so the plain queue has a plain URL", () => {
    expect(toSearch(plain).toString()).toBe("");
  });

  it("writes every control the way the queue API reads it", () => {
    const s = toSearch({
      ...plain,
      status: ["awaiting-decision", "changes-requested"],
      verdict: ["contradicted"],
      q: "  grazing herds ",
      author: "varga",
      version: "2",
      minContradicted: "1",
      submittedFrom: "2026-11-01",
      submittedTo: "2026-12-02",
      sort: "title",
      dir: "asc",
      page: 3,
      pageSize: 50,
    });
    expect(Object.fromEntries(s)).toEqual({
      status: "awaiting-decision,changes-requested",
      verdict: "contradicted",
      q: "grazing herds",
      author: "varga",
      version: "2",
      minContradicted: "1",
      submittedFrom: "2026-11-01",
      submittedTo: "2026-12-02",
      sort: "title",
      dir: "asc",
      page: "3",
      pageSize: "50",
    });
  });

  it("round-trips through the server's query parser", () => {
    const c: QueueControls = { ...plain, status: ["declined"], verdict: ["pending"], q: "dune", version: "4", sort: "inconclusive", dir: "asc", page: 2, pageSize: 10 };
    const q = parseQueueQuery(toSearch(c));
    expect(q).toMatchObject({ status: ["declined"], verdict: ["pending"], q: "dune", version: 4, sort: "inconclusive", dir: "asc", page: 2, pageSize: 10 });
  });
});
