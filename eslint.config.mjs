import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import prettier from "eslint-config-prettier";

/** The framework-free numerical core: importable from tests and the command line without Next. */
const SCIENCE = [
  "lib/fft",
  "lib/readout",
  "lib/spacing",
  "lib/synthetic",
  "lib/imaging",
  "lib/kinetics",
  "lib/stability",
  "lib/fitting",
  "lib/simulation",
  "lib/stats",
  "lib/access",
  "lib/errors",
];
/** Node-only helpers of the core (worker threads): may use node:*, still no framework. */
const NODE_ONLY_CORE = ["lib/parallel"];

const FRAMEWORK = [
  "next",
  "next/*",
  "next-auth",
  "next-auth/*",
  "react",
  "react-dom",
  "sequelize",
  "umzug",
  "@aws-sdk/*",
  "nodemailer",
  "formidable",
  "swr",
];
const OUTSIDE_CORE = [
  "@/app/*",
  "@/components/*",
  "@/models",
  "@/models/*",
  "@/storage/*",
  "@/lib/server/*",
  "@/lib/client/*",
  "@/lib/cli/*",
];
const NODE_IO = ["node:*", "fs", "path", "os", "child_process", "worker_threads"];
const FAKES = {
  group: ["@/fake-services/*", "**/fake-services/*"],
  message: "The app reaches the fakes only over the network, like real services.",
};

const frameworkFree = (extra) => [
  "error",
  {
    patterns: [
      {
        group: FRAMEWORK,
        message: "lib/<science> stays framework-free: no Next, React, Sequelize or service clients here.",
      },
      { group: OUTSIDE_CORE, message: "lib/<science> may import only from lib/ science folders and numeric packages." },
      FAKES,
      ...extra,
    ],
  },
];

const config = [
  ...nextVitals,
  ...nextTs,
  prettier,
  {
    ignores: [
      "tmp/**",
      "tmp-*",
      ".next/**",
      ".next-*/**",
      "node_modules/**",
      "storage/data*/**",
      "test-results/**",
      "playwright-report/**",
      "next-env.d.ts",
    ],
  },
  {
    rules: {
      "@typescript-eslint/no-explicit-any": "error",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  { files: ["**/*.cjs"], rules: { "@typescript-eslint/no-require-imports": "off" } },
  // Order matters: for one rule the last matching block wins, so general rules come first.
  {
    files: ["app/**/*.{ts,tsx}", "components/**/*.{ts,tsx}", "lib/**/*.{ts,tsx}", "models/**/*.ts", "storage/**/*.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: [FAKES] }] },
  },
  {
    files: SCIENCE.map((d) => `${d}/**/*.ts`),
    rules: {
      "no-restricted-imports": frameworkFree([
        { group: NODE_IO, message: "lib/<science> does no I/O: pass data in, return plain results." },
      ]),
      "no-restricted-properties": [
        "error",
        { object: "process", property: "env", message: "lib/<science> takes options, never environment variables." },
      ],
    },
  },
  { files: NODE_ONLY_CORE.map((d) => `${d}/**/*.ts`), rules: { "no-restricted-imports": frameworkFree([]) } },
  {
    files: ["migrations/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            FAKES,
            {
              group: ["@/models", "@/models/*", "../models/*"],
              message: "Migrations describe tables; they never import models.",
            },
          ],
        },
      ],
    },
  },
];

export default config;
