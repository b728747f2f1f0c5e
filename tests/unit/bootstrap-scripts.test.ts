// The first command a newcomer runs must work: these checks keep the bootstrap scripts from calling
// a tool that is not in the lock file or installing without the development tools.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const read = (file: string) => readFileSync(path.join(root, file), "utf8");
const shellFiles = (dir: string): string[] =>
  readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((d) =>
    d.isDirectory() ? (d.name === "node_modules" ? [] : shellFiles(path.join(dir, d.name))) : d.name.endsWith(".sh") ? [path.join(dir, d.name)] : [],
  );
/** Every command the project runs: its shell scripts, the CI entry and package.json's scripts. */
const commands = (): Array<{ where: string; text: string }> => [
  ...shellFiles("scripts").map((file) => ({ where: file, text: read(file) })),
  { where: ".ci/run", text: read(".ci/run") },
  ...Object.entries(JSON.parse(read("package.json")).scripts as Record<string, string>).map(([name, text]) => ({ where: `package.json scripts.${name}`, text })),
];
// comments may name npx (to say why it is not used); commands may not
const code = (text: string) => text.split("\n").filter((line) => !line.trim().startsWith("#")).join("\n");

describe("bootstrap scripts", () => {
  it("finds the scripts it checks", () => {
    expect(commands().map((c) => c.where)).toEqual(expect.arrayContaining(["scripts/start.sh", "scripts/test.sh", "scripts/dev.sh", "scripts/bench.sh", "scripts/lib/common.sh"]));
  });

  it("never call npx, which fetches a package the lock file does not have instead of failing", () => {
    const offenders = commands().filter((c) => /(^|[\s;&|(`"'])npx\s/m.test(code(c.text))).map((c) => c.where);
    expect(offenders).toEqual([]);
  });

  it("install the development tools whatever NODE_ENV says", () => {
    const common = code(read("scripts/lib/common.sh"));
    const installs = common.match(/^\s*\(?.*\bnpm ci\b[^\n]*/gm)?.filter((line) => !/\blog\b/.test(line)) ?? [];
    expect(installs.length).toBeGreaterThan(0);
    for (const line of installs) expect(line).toContain("--include=dev");
  });

  it("npm start sets NODE_ENV for the server process only, never for the install or the build", () => {
    const start = code(read("scripts/start.sh"));
    expect(start).not.toMatch(/export\s+NODE_ENV/);
    expect(start).toMatch(/unset NODE_ENV/);
    expect(start).toMatch(/NODE_ENV=production node build\/server\/index\.js/);
  });

  it("npm start stops the stand-ins it lists and the database on Ctrl-C", () => {
    const start = code(read("scripts/start.sh"));
    expect(start).toMatch(/for program in "\$\{STAND_INS\[@\]\}"/);
    expect(start).toMatch(/trap '[^']*cleanup[^']*' INT TERM/);
    expect(start).toMatch(/pg_stop/);
    expect(code(read("scripts/lib/common.sh"))).toMatch(/STAND_INS=\(\s*\n\s*fake-services\/mail\/index\.ts/);
  });
});
