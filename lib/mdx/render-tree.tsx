import type { Root } from "hast";
import { toJsxRuntime, type Components } from "hast-util-to-jsx-runtime";
import type { AnchorHTMLAttributes, ComponentType, ReactNode } from "react";
import { Fragment, jsx, jsxs } from "react/jsx-runtime";
import { MdxProblemNote } from "@/components/mdx/mdx-problem-note";
import { PROBLEM_NOTE_COMPONENT, type EmbedName } from "./policy";

// Client-safe: the live preview renders the tree the server compiled with this same function.

// Writers' links point away from Benchplate: readers should see that, and search engines should not credit them.
function ReportLink(props: AnchorHTMLAttributes<HTMLAnchorElement>) {
  return <a {...props} rel="nofollow ugc noopener" />;
}

/** What each of our components receives: its attributes from the MDX, always strings. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each embed declares its own string props; the tree guarantees only those reach it
export type EmbedComponents = Record<EmbedName, ComponentType<any>>;

/**
 * Turns a tree from compileSafeMdx into React elements. Only tags and components the sanitiser kept can be in it,
 * and no expression is ever evaluated (there is no evaluater: an expression node would throw, and none survive).
 */
export function renderSafeTree(tree: Root, embeds: EmbedComponents): ReactNode {
  return toJsxRuntime(tree, {
    Fragment,
    jsx,
    jsxs,
    passKeys: true,
    elementAttributeNameCase: "react",
    components: { ...embeds, [PROBLEM_NOTE_COMPONENT]: MdxProblemNote, a: ReportLink } as Partial<Components>,
  });
}
