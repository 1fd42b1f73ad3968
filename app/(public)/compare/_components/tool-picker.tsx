"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState, useSyncExternalStore, useTransition, type KeyboardEvent } from "react";
import { compareHref, type CompareSide } from "@/lib/validations/compare";

export type PickedTool = { slug: string; name: string };

type Suggestion = PickedTool & { category: string };

const debounceMs = 200;

const subscribeToNothing = () => () => {};
const suggestionLimit = 8;

/**
 * A tool picker that searches the catalogue as the reader types (GET /api/tools), as an ARIA combobox: arrows move
 * through the suggestions, Enter chooses, Escape closes. Choosing replaces the page's URL, so the server renders the
 * new comparison and the address stays shareable. Before hydration the input is a plain text field named `q<side>`
 * that the form sends, and the page resolves the text to a tool. The page keys it by the picked tool, so a new
 * comparison (the back button, the other picker) starts it afresh with that tool's name.
 */
export function ToolPicker({
  side,
  label,
  picked,
  current,
}: {
  side: CompareSide;
  label: string;
  picked: PickedTool | null;
  current: Record<CompareSide, string | null>;
}) {
  const router = useRouter();
  const id = useId();
  const listId = `${id}-list`;
  const hydrated = useSyncExternalStore(subscribeToNothing, () => true, () => false);
  const [text, setText] = useState(picked?.name ?? "");
  const [suggestions, setSuggestions] = useState<Suggestion[]>([]);
  const [total, setTotal] = useState(0);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const [status, setStatus] = useState<"idle" | "searching" | "failed">("idle");
  const [pending, startTransition] = useTransition();
  const pendingRequest = useRef<AbortController | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  useEffect(
    () => () => {
      pendingRequest.current?.abort();
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  function search(query: string) {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(async () => {
      // Only the newest request may fill the list: an older, slower answer would show suggestions for stale text.
      pendingRequest.current?.abort();
      const controller = new AbortController();
      pendingRequest.current = controller;
      setStatus("searching");
      try {
        const params = new URLSearchParams({ perPage: String(suggestionLimit) });
        if (query.trim()) params.set("q", query.trim());
        const response = await fetch(`/api/tools?${params}`, { signal: controller.signal, headers: { Accept: "application/json" } });
        if (!response.ok) throw new Error(`status ${response.status}`);
        const tools = (await response.json()) as { slug: string; maker: string; model: string; category: string }[];
        setSuggestions(tools.map((tool) => ({ slug: tool.slug, name: `${tool.maker} ${tool.model}`, category: tool.category })));
        setTotal(Number(response.headers.get("X-Total-Count") ?? tools.length));
        setActive(-1);
        setOpen(true);
        setStatus("idle");
      } catch (error) {
        if ((error as Error).name === "AbortError") return;
        setSuggestions([]);
        setStatus("failed");
        setOpen(true);
      }
    }, debounceMs);
  }

  function choose(tool: Suggestion) {
    setText(tool.name);
    setOpen(false);
    setActive(-1);
    startTransition(() => router.replace(compareHref({ ...current, [side]: tool.slug }), { scroll: false }));
  }

  function onKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    if (event.key === "ArrowDown" || event.key === "ArrowUp") {
      event.preventDefault();
      if (!open) {
        search(text);
        return;
      }
      if (suggestions.length === 0) return;
      const step = event.key === "ArrowDown" ? 1 : -1;
      setActive((index) => (index + step + suggestions.length) % suggestions.length);
    } else if (event.key === "Enter") {
      const chosen = open ? suggestions[active] : undefined;
      if (chosen) {
        event.preventDefault();
        choose(chosen);
      } else if (hydrated) {
        // The picker's text is not a tool: Enter opens the suggestions instead of sending the form.
        event.preventDefault();
        search(text);
      }
    } else if (event.key === "Escape") {
      if (open) {
        event.preventDefault();
        setOpen(false);
        setActive(-1);
      }
    }
  }

  const activeSuggestion = open ? suggestions[active] : undefined;
  const message =
    status === "searching"
      ? "Searching…"
      : status === "failed"
        ? "The catalogue could not be searched just now; try again."
        : open
          ? suggestions.length === 0
            ? "No tool matches that text."
            : `${total} tool${total === 1 ? "" : "s"} found${total > suggestions.length ? `, the first ${suggestions.length} shown` : ""}; arrow keys to move, Enter to choose.`
          : "";

  return (
    <div className="relative flex flex-col gap-1">
      <label htmlFor={`${id}-input`} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <input
        id={`${id}-input`}
        // Before hydration the form sends the typed text; afterwards the chosen tool goes into the URL instead.
        name={hydrated ? undefined : `q${side}`}
        type="text"
        role="combobox"
        autoComplete="off"
        spellCheck={false}
        aria-autocomplete="list"
        aria-expanded={open}
        aria-controls={listId}
        aria-activedescendant={activeSuggestion ? `${id}-option-${activeSuggestion.slug}` : undefined}
        aria-describedby={`${id}-status`}
        placeholder="Type a maker or model"
        value={text}
        onChange={(event) => {
          setText(event.target.value);
          search(event.target.value);
        }}
        onFocus={(event) => event.target.select()}
        onBlur={() => setOpen(false)}
        onKeyDown={onKeyDown}
        className="w-full rounded border border-rule bg-paper-raised px-3 py-2 text-base text-ink"
      />
      <ul
        id={listId}
        role="listbox"
        aria-label={`Suggestions for ${label.toLowerCase()}`}
        hidden={!open || suggestions.length === 0}
        className="absolute top-full z-20 mt-1 max-h-80 w-full overflow-y-auto rounded border border-rule bg-paper-raised py-1 shadow-lg"
      >
        {suggestions.map((tool, index) => (
          <li
            key={tool.slug}
            id={`${id}-option-${tool.slug}`}
            role="option"
            aria-selected={index === active}
            // Chosen on mouse down, before the input's blur closes the list.
            onMouseDown={(event) => {
              event.preventDefault();
              choose(tool);
            }}
            onMouseMove={() => setActive(index)}
            className={`cursor-pointer px-3 py-2 text-sm ${index === active ? "bg-copper-wash text-ink" : "text-ink"}`}
          >
            {tool.name}
            {tool.slug === picked?.slug ? <span className="ml-2 text-xs text-ink-faint">(shown now)</span> : null}
          </li>
        ))}
      </ul>
      <p id={`${id}-status`} aria-live="polite" className="min-h-5 text-xs text-ink-faint">
        {pending ? "Loading the comparison…" : message}
      </p>
    </div>
  );
}
