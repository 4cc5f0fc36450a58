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
