import js from "@eslint/js";
import tseslint from "typescript-eslint";
import globals from "globals";

export default tseslint.config(
  { ignores: ["node_modules/", "dist/", "build/", "demo/", "test-output/", "test/fixtures/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_" }],
      eqeqeq: ["error", "always"],
      // A spread passes every element as an argument: past about 100,000 elements (a whole-column
      // range, a long file) the call overflows the stack. Loop or reduce instead.
      "no-restricted-syntax": [
        "error",
        {
          selector:
            "CallExpression[callee.object.name='Math'][callee.property.name=/^(max|min|hypot)$/] > SpreadElement",
          message:
            "Math.max/min(...array) overflows the stack on large arrays; use a loop or reduce.",
        },
        {
          selector:
            "CallExpression[callee.property.name=/^(push|unshift|fromCharCode)$/] > SpreadElement",
          message:
            "push/unshift/fromCharCode(...array) overflows the stack on large arrays; use a loop.",
        },
      ],
    },
  },
  {
    // Core and report are pure: no Office, no DOM globals, no file system.
    files: ["src/core/**/*.ts", "src/report/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: ["node:*", "fs", "path", "../cli/*", "../../functions/*", "../../taskpane/*"] },
      ],
      "@typescript-eslint/no-explicit-any": "error",
    },
  },
);
