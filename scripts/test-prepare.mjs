// The steps `npm test` runs before vitest, in two lanes at once so that both cores work: the type
// check then the lint in one lane, the CLI bundles then both add-in builds (`build:test`) in the
// other. The tests only read what the builds write, so nothing is built twice in a run. Each
// step's output is printed when it ends, with its wall time; any failure fails the whole.
import { spawn } from "node:child_process";

const LANES = [
  ["typecheck", "lint"],
  ["build:cli", "build:test"],
];

const npm = process.platform === "win32" ? "npm.cmd" : "npm";

/** Runs `npm run -s <script>`, resolving to its exit status, output and wall time. */
function run(script) {
  const started = Date.now();
  return new Promise((done) => {
    const child = spawn(npm, ["run", "-s", script], { stdio: ["ignore", "pipe", "pipe"] });
    const output = [];
    child.stdout.on("data", (chunk) => output.push(chunk));
    child.stderr.on("data", (chunk) => output.push(chunk));
    child.on("close", (status) => {
      const seconds = ((Date.now() - started) / 1000).toFixed(1);
      done({ script, status: status ?? 1, output: Buffer.concat(output).toString(), seconds });
    });
  });
}

/** The lane's steps one after another; a failed step ends its lane. */
async function lane(scripts) {
  for (const script of scripts) {
    const result = await run(script);
    const mark = result.status === 0 ? "ok" : `FAILED (exit status ${result.status})`;
    process.stdout.write(`${result.output}npm run ${script}: ${mark} in ${result.seconds} s\n`);
    if (result.status !== 0) return false;
  }
  return true;
}

const results = await Promise.all(LANES.map(lane));
process.exitCode = results.every(Boolean) ? 0 : 1;
