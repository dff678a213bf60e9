/** Every row of route-matrix.ts, as an anonymous visitor and as each demo role. */
import { beforeAll, describe, expect, it } from "vitest";
import { app, sessionCookie } from "./support/harness";
import { ROUTES, type Who } from "./route-matrix";

const cookies: Partial<Record<Who, string>> = {};

beforeAll(async () => {
  for (const role of ["author", "editor", "admin"] as const) cookies[role] = await sessionCookie(role);
});

describe.each(ROUTES.flatMap((row) => Object.entries(row.expect).map(([who, status]) => ({ row, who: who as Who, status }))))(
  "$row.method $row.path as $who",
  ({ row, who, status }) => {
    it(`answers ${status}`, async () => {
      const { baseUrl } = app();
      const headers = new Headers({ origin: baseUrl });
      const cookie = cookies[who];
      if (cookie !== undefined) headers.set("cookie", cookie);
      if (row.body !== undefined) headers.set("content-type", "application/json");
      const res = await fetch(`${baseUrl}${row.path}`, {
        method: row.method ?? "GET",
        headers,
        body: row.body === undefined ? undefined : JSON.stringify(row.body),
        redirect: "manual",
      });
      expect(res.status, `${row.method ?? "GET"} ${row.path} as ${who}`).toBe(status);
    });
  },
);
