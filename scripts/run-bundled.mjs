// node scripts/run-bundled.mjs SCRIPT.ts [ARGS…]: runs a TypeScript script as one bundle on plain Node.
// Our own because tsx, which runs the other scripts, keeps its loader hooks on a thread of their own (about 30 MB),
// and the capture analysis must stay under 300 MB; esbuild, tsx's own compiler, makes the bundle.

import { mkdirSync, rmSync } from "node:fs";
import { readFile } from "node:fs/promises";
import { basename, dirname, join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { build, stop } from "esbuild";

const [script, ...args] = process.argv.slice(2);
if (script === undefined) {
  process.stderr.write("usage: node scripts/run-bundled.mjs SCRIPT.ts [ARGS…]\n");
  process.exit(2);
}
const entry = resolve(script);
const root = resolve(import.meta.dirname, "..");

/** Each module keeps its own import.meta.url and dirname in the bundle, so files it finds beside itself stay found. */
const ownImportMeta = {
  name: "own-import-meta",
  setup(bundler) {
    bundler.onLoad({ filter: /\.[cm]?tsx?$/ }, async ({ path }) => {
      if (path.includes("/node_modules/")) return undefined;
      const source = await readFile(path, "utf8");
      return {
        loader: path.endsWith("x") ? "tsx" : "ts",
        contents: source
          .replaceAll("import.meta.url", JSON.stringify(pathToFileURL(path).href))
          .replaceAll("import.meta.dirname", JSON.stringify(dirname(path))),
      };
    });
  },
};

// Inside node_modules, so the packages left out of the bundle resolve as they do for the script itself.
const cache = join(root, "node_modules", ".cache", "benchplate");
mkdirSync(cache, { recursive: true });
const outfile = join(cache, `${basename(entry).replace(/\.[cm]?tsx?$/, "")}-${process.pid}.mjs`);
await build({
  entryPoints: [entry],
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  packages: "external",
  outfile,
  logLevel: "warning",
  plugins: [ownImportMeta],
});
await stop();
process.argv = [process.argv[0], entry, ...args];
try {
  await import(pathToFileURL(outfile).href);
} finally {
  rmSync(outfile, { force: true });
}
