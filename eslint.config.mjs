// Lint: Next's recommended + core-web-vitals rules, TypeScript rules, and Sward's house rules.
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  { ignores: [".next/**", "node_modules/**", ".data/**", "next-env.d.ts", "tests/.artifacts/**"] },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_" },
      ],
      // One door to the database: only data-access modules import the Kysely instance.
      "no-restricted-imports": [
        "error",
        {
          paths: [
            {
              name: "@/db",
              message: "Only lib/**/queries.ts and lib/**/mutations.ts import the database.",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["lib/**/queries.ts", "lib/**/mutations.ts", "db/**", "tests/**"],
    rules: { "no-restricted-imports": "off" },
  },
  {
    // Migrations are frozen in time and take Kysely<any>.
    files: ["db/migrations/**"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
];

export default config;
