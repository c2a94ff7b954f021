import { Form } from "react-router";
import { formatDate } from "~/domain";
import { buttonClass, Card } from "~/components/ui";

interface Session {
  ref: string;
  current: boolean;
  createdAt: Date | string;
  lastSeenAt: Date | string;
  userAgent: string | null;
  method: string;
}

/** Where the user is signed in, with a sign-out for each other device and for all of them. */
export function SessionsSection({ sessions }: { sessions: Session[] }) {
  return (
    <Card as="section" aria-labelledby="sessions-heading">
      <h2 id="sessions-heading" className="mb-2 text-lg font-semibold">
        Where you are signed in
      </h2>
      <p className="mb-3 text-sm text-stone-600">
        A session ends after 14 days without use, and after 60 days in any case.
      </p>
      <ul className="divide-y divide-stone-100">
        {sessions.map((s) => (
          <li key={s.ref} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
            <span>
              <span className="font-semibold">{s.current ? "This device" : describeAgent(s.userAgent)}</span>{" "}
              <span className="text-stone-600">
                · {s.method === "oidc" ? "provider" : "e-mail link"} · since {formatDate(s.createdAt)} · last seen{" "}
                {formatDate(s.lastSeenAt)}
              </span>
            </span>
            {!s.current && (
              <Form method="post">
                <input type="hidden" name="intent" value="end-session" />
                <input type="hidden" name="ref" value={s.ref} />
                <button type="submit" className={buttonClass("plain", "sm")}>
                  Sign out
                </button>
              </Form>
            )}
          </li>
        ))}
      </ul>
      {sessions.length > 1 && (
        <Form method="post" className="mt-3">
          <input type="hidden" name="intent" value="end-other-sessions" />
          <button type="submit" className={buttonClass("plain", "sm")}>
            Sign out everywhere else
          </button>
        </Form>
      )}
    </Card>
  );
}

function describeAgent(ua: string | null) {
  if (!ua) return "Unknown device";
  if (/iPhone|Android/.test(ua)) return "Phone";
  if (/Chrome|Chromium/.test(ua)) return "Chromium-based browser";
  if (/Firefox/.test(ua)) return "Firefox";
  if (/Safari/.test(ua)) return "Safari";
  return "Other device";
}
