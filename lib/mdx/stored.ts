import type { Root } from "hast";
import { compileSafeMdx, type MdxProblem } from "./compile";

// A published revision keeps its body compiled: the sanitised tree as JSON, made once when the desk approves it.
// Reader pages only turn that tree into elements (renderSafeTree); the parser and sanitiser never run for a reader.

let compilations = 0;

/** How many bodies were compiled for storage in this process: tests use it to show one compilation per revision. */
export function storedCompilationCount(): number {
  return compilations;
}

/** Null `stored` when the source does not parse; `problems` then say where. */
export function compileForStorage(source: string): { stored: string | null; problems: MdxProblem[] } {
  compilations++;
  const { tree, problems } = compileSafeMdx(source);
  return { stored: tree ? JSON.stringify(tree) : null, problems };
}

export function readStoredTree(stored: string): Root {
  return JSON.parse(stored) as Root;
}
