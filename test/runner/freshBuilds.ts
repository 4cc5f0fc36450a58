/**
 * Vitest's global setup: checks once, before any test file runs, that the builds the tests read
 * are fresher than every source that went into them, and hands the answer to the tests
 * (`requireFreshBuild`). Nothing is built here: `npm test` builds once before vitest starts, and
 * a test of a stale build fails with the command that makes it.
 */
import type { TestProject } from "vitest/node";
import { BUILD_COMMAND, staleness, type BuildKind, type BuildStaleness } from "./builds";

export default function freshBuilds(project: TestProject): void {
  const stale: BuildStaleness = {};
  for (const kind of ["local", "cdn", "cli"] as const satisfies readonly BuildKind[]) {
    const reason = staleness(kind);
    if (reason === undefined) continue;
    stale[kind] = reason;
    console.log(
      `NOTICE: the ${kind} build is stale (${reason}); the tests that read it fail until ` +
        `"${BUILD_COMMAND[kind]}" runs.`,
    );
  }
  project.provide("staleBuilds", stale);
}
