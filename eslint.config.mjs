import js from "@eslint/js";
import tseslint from "typescript-eslint";
import globals from "globals";

// A spread passes every element as an argument: past about 100,000 elements (a whole-column
// range, a long file) the call overflows the stack. Loop or reduce instead.
const STACK_SAFE_CALLS = [
  {
    selector:
      "CallExpression[callee.object.name='Math'][callee.property.name=/^(max|min|hypot)$/] > SpreadElement",
    message: "Math.max/min(...array) overflows the stack on large arrays; use a loop or reduce.",
  },
  {
    selector:
      "CallExpression[callee.property.name=/^(push|unshift|fromCharCode)$/] > SpreadElement",
    message: "push/unshift/fromCharCode(...array) overflows the stack on large arrays; use a loop.",
  },
];

// The parts and the one direction of their imports (DESIGN.md, "Parts"): functions, taskpane and
// cli → report → core; core imports nothing of the others. Each part's files get one
// no-restricted-imports setting (a later setting of a rule replaces an earlier one).
const NO_FILE_SYSTEM = ["node:*", "fs", "path"];

/** A relative import matching `regex` is refused with `message`. */
function forbid(regex, message) {
  return { regex, message };
}

export default tseslint.config(
  { ignores: ["node_modules/", "dist/", "build/", "demo/", "test-output/", "test/fixtures/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_" }],
      eqeqeq: ["error", "always"],
      "no-restricted-syntax": ["error", ...STACK_SAFE_CALLS],
    },
  },
  {
    // Core and report are pure: no Office, no DOM globals, no file system.
    files: ["src/core/**/*.ts", "src/report/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "error" },
  },
  {
    files: ["src/core/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: NO_FILE_SYSTEM, message: "src/core is pure: no file system." },
            forbid("^\\.\\.(/|$)", "src/core imports nothing outside src/core (DESIGN.md, Parts)."),
          ],
        },
      ],
    },
  },
  {
    files: ["src/report/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: NO_FILE_SYSTEM, message: "src/report is pure: no file system." },
            forbid(
              "^\\.\\./(?!core(/|$))",
              "src/report imports only src/core (DESIGN.md, Parts: functions, taskpane, cli → report → core).",
            ),
          ],
        },
      ],
    },
  },
  {
    files: ["src/cli/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            forbid(
              "^\\.\\./\\.\\./(functions|taskpane)(/|$)",
              "src/cli imports report and core, never the cell functions or the pane (DESIGN.md, Parts).",
            ),
          ],
        },
      ],
    },
  },
  {
    files: ["functions/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            forbid(
              "^(\\.\\./)+(src/(cli|sim)|taskpane)(/|$)",
              "functions/ imports report and core, never the CLI or the pane (DESIGN.md, Parts).",
            ),
          ],
        },
      ],
    },
  },
  {
    files: ["taskpane/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            forbid(
              "^(\\.\\./)+(src/(cli|sim)|functions)(/|$)",
              "taskpane/ imports report and core (and the demo data), never the CLI or the cell functions (DESIGN.md, Parts).",
            ),
          ],
        },
      ],
    },
  },
  {
    // The edges do no arithmetic (STYLE.md 2: nothing numeric happens in functions/; the pane only
    // shows what src/report builds). Clamping an index or a pixel size is not statistics, so
    // Math.min, max, floor, ceil, round and trunc stay allowed.
    files: ["functions/**/*.ts", "taskpane/**/*.ts"],
    rules: {
      "no-restricted-syntax": [
        "error",
        ...STACK_SAFE_CALLS,
        {
          selector:
            "MemberExpression[object.name='Math'][property.name!=/^(min|max|floor|ceil|round|trunc)$/]",
          message:
            "Arithmetic belongs in src/core: the edges call it and shape the result (only index and pixel clamping with Math.min/max/floor/ceil/round/trunc here).",
        },
      ],
    },
  },
);
