/**
 * `npm start`'s certificates (scripts/dev-certs.cjs): a development CA still valid is reused, so
 * the user trusts it once, and the days it has left are told; one about to expire is replaced.
 */
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";

const require = createRequire(import.meta.url);
const { devCertificates } = require("../../scripts/dev-certs.cjs") as {
  devCertificates: (
    paths: { ca: string; cert: string; key: string },
    now?: number,
  ) => Promise<{ https?: unknown; reused?: boolean; daysLeft?: number; problem?: string }>;
};

const DAY = 24 * 3600 * 1000;

describe("devCertificates(paths, now)", () => {
  const dir = mkdtempSync(join(tmpdir(), "echolot-certs-"));
  const paths = {
    ca: join(dir, "ca.crt"),
    cert: join(dir, "localhost.crt"),
    key: join(dir, "localhost.key"),
  };
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("makes a set once, then reuses the same CA while it is valid and says how long", async () => {
    const first = await devCertificates(paths);
    expect(first.problem).toBeUndefined();
    expect(first.reused).toBe(false);
    // office-addin-dev-certs makes certificates valid for 30 days.
    expect(first.daysLeft).toBeGreaterThanOrEqual(29);
    const ca = readFileSync(paths.ca, "utf8");

    const later = await devCertificates(paths, Date.now() + 10 * DAY);
    expect(later.reused).toBe(true);
    // Whole days left, rounded down: ten days on, ten fewer (or eleven, across a day's edge).
    expect(later.daysLeft).toBeLessThanOrEqual((first.daysLeft ?? 0) - 10);
    expect(later.daysLeft).toBeGreaterThanOrEqual((first.daysLeft ?? 0) - 11);
    expect(readFileSync(paths.ca, "utf8")).toBe(ca);
  }, 60_000);

  it("replaces a set that expires within a day", async () => {
    const ca = readFileSync(paths.ca, "utf8");
    const nearEnd = await devCertificates(paths, Date.now() + 29.5 * DAY);
    expect(nearEnd.reused).toBe(false);
    expect(readFileSync(paths.ca, "utf8")).not.toBe(ca);
  }, 60_000);
});
