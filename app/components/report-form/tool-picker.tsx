// Type to find the tool; suggestions come from /api/models/suggest through a fetcher. A combobox
// in the WAI-ARIA pattern (list autocomplete): ↓/↑ move through the suggestions, Enter picks one
// (and never sends the form), Escape closes the list, then clears the text; focus stays in the box.
// Without JavaScript the typed text is sent and the server matches it to a model code.
import { type KeyboardEvent, useEffect, useId, useRef, useState } from "react";
import { useFetcher } from "react-router";
import { FieldError, inputClass } from "~/components/field";
import { cx } from "~/components/ui";

export interface ToolChoice {
  slug: string;
  label: string;
  detail?: string;
  categorySlug: string;
  action: "percussive" | "rotary";
  maxInletKpa: number;
}

interface ToolPickerProps {
  initial: ToolChoice | null;
  error?: string;
  onPick: (tool: ToolChoice | null) => void;
}

export function ToolPicker({ initial, error, onPick }: ToolPickerProps) {
  const fetcher = useFetcher<{ suggestions: ToolChoice[] }>();
  const [text, setText] = useState(initial?.label ?? "");
  const [picked, setPicked] = useState<ToolChoice | null>(initial);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const inputRef = useRef<HTMLInputElement>(null);
  const id = useId();
  const inputId = `${id}-tool`;
  const listId = "tool-suggestions";
  const hintId = `${id}-hint`;

  // Text typed before the page finished loading its scripts is picked up, not lost.
  useEffect(() => {
    const typed = inputRef.current?.value ?? "";
    if (typed && typed !== text) {
      setText(typed);
      setOpen(true);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- runs once on hydration: reads what was typed before it
  }, []);

  const query = text.trim();
  useEffect(() => {
    if (!open || query.length < 1 || picked?.label === text) return;
    const t = setTimeout(() => void fetcher.load(`/api/models/suggest?q=${encodeURIComponent(query)}`), 150);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the fetcher object changes on every load; the query decides
  }, [query, open]);

  const suggestions = open && query && picked?.label !== text ? (fetcher.data?.suggestions ?? []) : [];
  const expanded = suggestions.length > 0;
  const current = expanded && active >= 0 && active < suggestions.length ? active : -1;
  const optionId = (i: number) => `${listId}-${i}`;

  // The active option stays in view as the arrows move through a long list.
  useEffect(() => {
    if (current >= 0) document.getElementById(optionId(current))?.scrollIntoView({ block: "nearest" });
  }, [current]);

  function choose(tool: ToolChoice) {
    setPicked(tool);
    setText(tool.label);
    setOpen(false);
    setActive(-1);
    onPick(tool);
    inputRef.current?.focus();
  }

  function onKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    switch (event.key) {
      case "ArrowDown":
      case "ArrowUp": {
        event.preventDefault();
        if (!expanded) {
          setOpen(true);
          return;
        }
        const step = event.key === "ArrowDown" ? 1 : -1;
        setActive((i) =>
          i < 0 ? (step > 0 ? 0 : suggestions.length - 1) : (i + step + suggestions.length) % suggestions.length,
        );
        return;
      }
      case "Home":
      case "End":
        if (!expanded || current < 0) return;
        event.preventDefault();
        setActive(event.key === "Home" ? 0 : suggestions.length - 1);
        return;
      case "Enter":
        // Enter in the tool box picks; it never sends the half-filled form.
        event.preventDefault();
        if (current >= 0) choose(suggestions[current]!);
        else if (suggestions.length === 1) choose(suggestions[0]!);
        return;
      case "Escape":
        if (expanded) {
          event.preventDefault();
          setOpen(false);
          setActive(-1);
        } else if (text && !picked) {
          event.preventDefault();
          setText("");
        }
        return;
    }
  }

  return (
    <div className="relative">
      <label htmlFor={inputId} className="font-semibold">
        Tool
      </label>
      <span id={hintId} className="block text-sm text-stone-600">
        Maker or model code; pick it from the list (↓ and Enter).
      </span>
      <input
        ref={inputRef}
        id={inputId}
        name="toolQuery"
        value={text}
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        placeholder="e.g. BH-150"
        role="combobox"
        aria-autocomplete="list"
        aria-expanded={expanded}
        aria-controls={listId}
        aria-activedescendant={current >= 0 ? optionId(current) : undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={cx(hintId, error && `${inputId}-error`)}
        onChange={(e) => {
          setText(e.target.value);
          setOpen(true);
          setActive(-1);
          if (picked) {
            setPicked(null);
            onPick(null);
          }
        }}
        onKeyDown={onKeyDown}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        className={inputClass}
      />
      {/* The picked model's slug. Not type=hidden, so that focusing the first field with an error
          (conform does, after a failed submit) can land here and pass focus on to the box. */}
      <input
        name="toolModel"
        value={picked?.slug ?? ""}
        readOnly
        tabIndex={-1}
        aria-hidden
        className="sr-only"
        onFocus={() => inputRef.current?.focus()}
      />
      <ul
        id={listId}
        role="listbox"
        aria-label="Matching tools"
        hidden={!expanded}
        className="absolute z-20 mt-1 max-h-72 w-full overflow-auto rounded border border-stone-300 bg-white shadow-lg"
      >
        {suggestions.map((s, i) => (
          <li
            key={s.slug}
            id={optionId(i)}
            role="option"
            aria-selected={i === current}
            // Keeps focus in the box: the list is never a tab stop of its own.
            onMouseDown={(e) => e.preventDefault()}
            onClick={() => choose(s)}
            onMouseMove={() => setActive(i)}
            className={cx(
              "block min-h-12 cursor-pointer px-3 py-2",
              i === current && "bg-bay-100 outline-2 -outline-offset-2 outline-bay-700",
            )}
          >
            <span className="font-semibold">{s.label}</span>
            <span className="block text-sm text-stone-600">{s.detail}</span>
          </li>
        ))}
      </ul>
      <p className="sr-only" role="status">
        {open && query && picked?.label !== text && fetcher.state === "idle" && fetcher.data
          ? `${suggestions.length} matching ${suggestions.length === 1 ? "tool" : "tools"}`
          : ""}
      </p>
      <FieldError id={inputId} message={error} />
    </div>
  );
}
