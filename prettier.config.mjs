// Formatting (npm run format; npm run lint checks it). Import order: Node built-ins, packages,
// then the project's own modules (@/…), then relative imports. Tailwind classes in their canonical order.
/** @type {import("prettier").Config} */
const config = {
  printWidth: 100,
  plugins: ["@ianvs/prettier-plugin-sort-imports", "prettier-plugin-tailwindcss"],
  importOrder: ["<BUILTIN_MODULES>", "<THIRD_PARTY_MODULES>", "", "^@/(.*)$", "", "^[./]"],
  importOrderTypeScriptVersion: "5.9.3",
  tailwindStylesheet: "./app/globals.css",
  tailwindFunctions: ["clsx"],
};

export default config;
