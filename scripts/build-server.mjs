// Compiles the server (and the shared code it imports) to plain JavaScript in build/, one file per
// source file so build/server/db/migrations/ still holds one module per migration. npm packages stay
// imports; each must be a runtime dependency, so a deployment never needs the development toolchain.
// `node scripts/build-server.mjs` (npm run build:server); start.sh and test.sh call it.
import { existsSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { builtinModules } from "node:module";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "rolldown";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const outDir = path.join(root, "build");
const migrations = path.join(root, "server/db/migrations");

const entries = [
  "server/index.ts",
  "server/cli/migrate.ts",
  "server/cli/seed.ts",
  ...readdirSync(migrations).filter((f) => /^\d{4}-.+\.ts$/.test(f)).map((f) => `server/db/migrations/${f}`),
];

const pkg = JSON.parse(readFileSync(path.join(root, "package.json"), "utf8"));
const runtime = new Set(Object.keys(pkg.dependencies ?? {}));
const builtins = new Set(builtinModules);
const packageOf = (id) => (id.startsWith("@") ? id.split("/").slice(0, 2).join("/") : id.split("/")[0]);
const bare = (id) => !id.startsWith(".") && !path.isAbsolute(id) && !id.startsWith("\0");
const misplaced = new Set();

rmSync(outDir, { recursive: true, force: true });
await build({
  cwd: root,
  input: entries,
  platform: "node",
  logLevel: "warn",
  external: (id) => {
    if (!bare(id)) return false;
    if (id.startsWith("node:") || builtins.has(id)) return true;
    if (!runtime.has(packageOf(id))) misplaced.add(packageOf(id));
    return true;
  },
  output: {
    dir: outDir,
    format: "esm",
    preserveModules: true,
    preserveModulesRoot: root,
    entryFileNames: "[name].js",
    sourcemap: true,
  },
});

if (misplaced.size) {
  console.error(
    `The server imports ${[...misplaced].join(", ")}, which package.json lists outside "dependencies": ` +
      `a production install would miss it. Move it with \`npm i -E NAME@VERSION\`.`,
  );
  process.exit(1);
}
for (const entry of ["server/index.js", "server/cli/migrate.js", "server/cli/seed.js"]) {
  if (!existsSync(path.join(outDir, entry)) || !statSync(path.join(outDir, entry)).size) {
    console.error(`server build: ${entry} is missing from build/`);
    process.exit(1);
  }
}
