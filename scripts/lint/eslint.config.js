// The project's lint rules, run by `npm test` (scripts/lint.sh) from the project root.
// Few rules, each worth a failing test: the one-way import rule that keeps the layout, React's
// hook rules, and typescript-eslint's recommended set.
import { readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import js from "@eslint/js";
import { createNodeResolver, importX } from "eslint-plugin-import-x";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const features = readdirSync(path.join(root, "src/features"), { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name);

// The one-way rule (DEVELOPERS.md, "The map"): `shared` imports nothing of ours; `server` and `src`
// import `shared`, never each other; `fake-services` imports nothing of the application; features
// do not import each other (pages compose them), and the client's common parts import no feature.
const zones = [
  { target: "./shared", from: ["./server", "./src", "./fake-services", "./scripts", "./tests"], message: "shared/ imports nothing of ours: move the code into shared/ or pass it in." },
  { target: "./server", from: ["./src", "./fake-services"], message: "server/ imports shared/, never the client or a stand-in." },
  { target: "./src", from: ["./server", "./fake-services"], message: "src/ imports shared/, never the server or a stand-in: share the type or schema through shared/." },
  { target: "./fake-services", from: ["./server", "./src", "./shared"], message: "A stand-in is a separate program speaking the hosted service's protocol: it imports nothing of the application." },
  ...features.map((name) => ({
    target: `./src/features/${name}`,
    from: "./src/features",
    except: [`./${name}`],
    message: "Features do not import each other: move the common part to src/components or src/lib, or compose them in a page.",
  })),
  { target: ["./src/components", "./src/lib", "./src/api", "./src/config"], from: ["./src/features", "./src/pages"], message: "The client's common parts import no feature or page." },
];

export default tseslint.config(
  { ignores: ["**/node_modules/**", "dist/**", "build/**", "coverage/**", ".data/**", ".test-results/**"] },
  {
    files: ["**/*.{ts,tsx}"],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    plugins: { "import-x": importX },
    settings: {
      "import-x/resolver-next": [createNodeResolver({ extensions: [".ts", ".tsx", ".d.ts", ".js", ".mjs", ".json"] })],
    },
    rules: {
      "import-x/no-restricted-paths": ["error", { basePath: root, zones }],
      // `let x = 0` before branches that all assign it reads fine; the unused-variable rule catches real leftovers
      "no-useless-assignment": "off",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none", ignoreRestSiblings: true }],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: { "react-hooks/rules-of-hooks": "error", "react-hooks/exhaustive-deps": "error" },
  },
);
