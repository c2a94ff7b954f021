// Type to find the tool; suggestions come from /api/models/suggest through a fetcher. Without
// JavaScript the typed text is sent and the server matches it to a model code.
import { useEffect, useRef, useState } from "react";
import { useFetcher } from "react-router";

export interface ToolChoice {
  slug: string;
  label: string;
  detail?: string;
  categorySlug: string;
  action: "percussive" | "rotary";
  maxInletKpa: number;
}

export function ToolPicker({ initial, error, onPick }: { initial: ToolChoice | null; error?: string; onPick: (tool: ToolChoice | null) => void }) {
  const fetcher = useFetcher<{ suggestions: ToolChoice[] }>();
  const [text, setText] = useState(initial?.label ?? "");
  const [picked, setPicked] = useState<ToolChoice | null>(initial);
  const [open, setOpen] = useState(false);
  const inputRef = useRef<HTMLInputElement>(null);

  // Text typed before the page finished loading its scripts is picked up, not lost.
  useEffect(() => {
    const typed = inputRef.current?.value ?? "";
    if (typed && typed !== text) {
      setText(typed);
      setOpen(true);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  useEffect(() => {
    if (!open || text.trim().length < 1 || picked?.label === text) return;
    const t = setTimeout(() => fetcher.load(`/api/models/suggest?q=${encodeURIComponent(text.trim())}`), 150);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [text, open]);

  const suggestions = open && picked?.label !== text ? fetcher.data?.suggestions ?? [] : [];
  const choose = (tool: ToolChoice) => {
    setPicked(tool);
    setText(tool.label);
    setOpen(false);
    onPick(tool);
  };

  return (
    <div className="relative">
      <label className="block">
        <span className="font-semibold">Tool</span>
        <input
          ref={inputRef} name="toolQuery" value={text} autoComplete="off" placeholder="Maker or model code, e.g. BH-150"
          role="combobox" aria-expanded={suggestions.length > 0} aria-controls="tool-suggestions" aria-invalid={error ? true : undefined}
          onChange={(e) => {
            setText(e.target.value);
            setOpen(true);
            if (picked) {
              setPicked(null);
              onPick(null);
            }
          }}
          onFocus={() => setOpen(true)}
          className={`mt-1 block w-full rounded border px-3 py-3 text-base ${error ? "border-red-600" : "border-stone-300"}`}
        />
      </label>
      <input type="hidden" name="toolModel" value={picked?.slug ?? ""} />
      {suggestions.length > 0 && (
        <ul id="tool-suggestions" role="listbox" className="absolute z-10 mt-1 max-h-72 w-full overflow-auto rounded border border-stone-300 bg-white shadow-lg">
          {suggestions.map((s) => (
            <li key={s.slug} role="option" aria-selected={false}>
              <button type="button" onClick={() => choose(s)} className="block w-full px-3 py-3 text-left hover:bg-bay-50">
                <span className="font-semibold">{s.label}</span>
                <span className="block text-xs text-stone-600">{s.detail}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {error && <p className="mt-1 text-sm text-red-700">{error}</p>}
    </div>
  );
}
