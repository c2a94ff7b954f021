// The house's small visual primitives: the card surface, the table frame and the button looks.
// Pages compose these instead of copying class strings, so a change of look happens in one place.
import type { HTMLAttributes, ReactNode } from "react";

/** Class names joined with spaces, skipping the empty and the false. */
export const cx = (...parts: (string | false | null | undefined)[]) => parts.filter(Boolean).join(" ");

type Padding = "none" | "sm" | "md" | "lg";
const PADDING: Record<Padding, string> = { none: "", sm: "p-3", md: "p-4", lg: "p-6" };

/** The card surface (white, light border, rounded), for elements that cannot be a `Card` (a `Form`, a `Link`). */
export function cardClass(padding: Padding = "md", className?: string) {
  return cx("rounded-lg border border-stone-200 bg-white", PADDING[padding], className);
}

type CardProps = HTMLAttributes<HTMLElement> & {
  as?: "div" | "section" | "article" | "aside" | "ul" | "ol";
  padding?: Padding;
};

/** A panel on the card surface; `as="ul"` with `padding="none"` for a list of rows. */
export function Card({ as: Tag = "div", padding = "md", className, ...props }: CardProps) {
  return <Tag className={cardClass(padding, className)} {...props} />;
}

type ButtonVariant = "primary" | "secondary" | "plain" | "danger";
type ButtonSize = "md" | "sm";
const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-bay-700 text-white hover:bg-bay-900",
  secondary: "border border-bay-700 text-bay-700 hover:bg-bay-50",
  plain: "border border-stone-300 hover:bg-stone-50",
  danger: "bg-red-800 text-white hover:bg-red-900",
};
// md is the bay's size: a 48 px target for a gloved thumb. sm is for rows and filter bars.
const SIZES: Record<ButtonSize, string> = { md: "px-4 py-3", sm: "px-3 py-2 text-sm" };

/** The look of a button, or of a link that acts as one. */
export function buttonClass(variant: ButtonVariant = "primary", size: ButtonSize = "md", className?: string) {
  return cx("rounded font-semibold disabled:opacity-60", VARIANTS[variant], SIZES[size], className);
}

// Written out whole so Tailwind sees each class; the hint shows below the width where the table scrolls.
const MIN_WIDTHS = {
  "40rem": { table: "min-w-[40rem]", hint: "sm:hidden" },
  "48rem": { table: "min-w-[48rem]", hint: "md:hidden" },
  "52rem": { table: "min-w-[52rem]", hint: "lg:hidden" },
} as const;

type DataTableProps = {
  /** Names the scrolling region for screen readers (and the table when there is no caption). */
  label: string;
  caption?: ReactNode;
  /** The header rows (`<tr>`s), set in the frame's header style. */
  head?: ReactNode;
  /** The body rows (`<tr>`s). */
  children: ReactNode;
  /** The table's least width; narrower screens scroll it sideways and show a hint. */
  minWidth?: keyof typeof MIN_WIDTHS;
  /** Show the sideways-scroll hint on phones even without a least width (columns that grow with the data). */
  scrollHint?: boolean;
  /** false: no card frame or header band, for tables set in running text. */
  framed?: boolean;
  className?: string;
  bodyClassName?: string;
};

/**
 * A table in a keyboard-scrollable region: on a narrow screen it scrolls sideways inside its frame
 * (the page itself never does) and says so.
 */
export function DataTable({
  label,
  caption,
  head,
  children,
  minWidth,
  scrollHint,
  framed = true,
  className,
  bodyClassName,
}: DataTableProps) {
  const width = minWidth ? MIN_WIDTHS[minWidth] : undefined;
  const hint = width?.hint ?? (scrollHint ? "md:hidden" : undefined);
  return (
    <div>
      {hint && (
        <p className={cx("mb-1 text-right text-xs text-stone-500", hint)} aria-hidden="true">
          Scroll sideways for more →
        </p>
      )}
      <div
        role="region"
        aria-label={label}
        tabIndex={0}
        className={cx("overflow-x-auto", framed && "rounded-lg border border-stone-200 bg-white")}
      >
        <table className={cx("w-full text-left text-sm", width?.table, className)}>
          {caption && <caption className="px-3 py-2 text-left font-semibold">{caption}</caption>}
          {head && (
            <thead className={framed ? "bg-stone-100 text-xs uppercase text-stone-600" : undefined}>{head}</thead>
          )}
          <tbody className={cx(framed && "divide-y divide-stone-100", bodyClassName)}>{children}</tbody>
        </table>
      </div>
    </div>
  );
}
