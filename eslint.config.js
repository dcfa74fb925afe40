// ESLint flat config: typescript-eslint's recommended rules, the Rules of Hooks, and accessibility
// checks for JSX. Formatting is Prettier's job (`prettier --check .` runs beside `npm run lint`).
import js from "@eslint/js";
import jsxA11y from "eslint-plugin-jsx-a11y";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

export default tseslint.config(
  {
    ignores: [
      "build/",
      ".react-router/",
      ".data/",
      "node_modules/",
      "test-results/",
      "playwright-report/",
      "public/",
      "reference-data/",
    ],
  },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    languageOptions: {
      globals: { ...globals.browser, ...globals.node },
    },
    rules: {
      "@typescript-eslint/no-unused-vars": [
        "error",
        {
          argsIgnorePattern: "^_",
          varsIgnorePattern: "^_",
          caughtErrorsIgnorePattern: "^_",
        },
      ],
    },
  },
  {
    files: ["app/**/*.tsx"],
    ...reactHooks.configs.flat.recommended,
  },
  {
    files: ["app/**/*.tsx"],
    ...jsxA11y.flatConfigs.recommended,
  },
);
