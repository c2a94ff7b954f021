import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { buttonClass, Card, cardClass, DataTable } from "~/components/ui";

describe("UI primitives", () => {
  it("builds the card surface with the padding asked for", () => {
    expect(cardClass()).toBe("rounded-lg border border-stone-200 bg-white p-4");
    expect(cardClass("none", "divide-y")).toBe("rounded-lg border border-stone-200 bg-white divide-y");
    expect(renderToStaticMarkup(createElement(Card, { as: "section", padding: "lg", "aria-label": "x" }, "hi"))).toBe(
      '<section class="rounded-lg border border-stone-200 bg-white p-6" aria-label="x">hi</section>',
    );
  });

  it("gives buttons and button-like links one look per variant", () => {
    expect(buttonClass()).toBe(
      "rounded font-semibold disabled:opacity-60 bg-bay-700 text-white hover:bg-bay-900 px-4 py-3",
    );
    expect(buttonClass("plain", "sm", "w-full")).toContain(
      "border-stone-300 hover:bg-stone-50 px-3 py-2 text-sm w-full",
    );
  });

  it("puts a table in a named, keyboard-scrollable region with a hint where it is wider than the screen", () => {
    const row = createElement("tr", null, createElement("td", null, "1"));
    const wide = renderToStaticMarkup(
      createElement(DataTable, { label: "Users", minWidth: "40rem", caption: "All users", children: row }),
    );
    expect(wide).toContain('role="region" aria-label="Users" tabindex="0"');
    expect(wide).toContain("min-w-[40rem]");
    expect(wide).toContain("<caption");
    expect(wide).toMatch(/class="[^"]*sm:hidden"[^>]*>Scroll sideways/);
    const narrow = renderToStaticMarkup(createElement(DataTable, { label: "Weeks", children: row }));
    expect(narrow).not.toContain("Scroll sideways");
    expect(narrow).not.toContain("<thead");
  });
});
