import { Link } from "react-router";
import { ErrorPage } from "~/components/error-page";
import { Card } from "~/components/ui";
import { listMessages } from "~/dev/mail.server";
import type { Route } from "./+types/dev.mail";

// Development only: the mail the local catcher received. A 404 wherever no catcher is configured.
export async function loader() {
  return { messages: await listMessages() };
}

export default function DevMail({ loaderData }: Route.ComponentProps) {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Local mail</h1>
      <p className="text-sm text-stone-600">
        Messages the local mail catcher received (newest first). This page does not exist in production.
      </p>
      {loaderData.messages.length === 0 ? (
        <p>No mail yet.</p>
      ) : (
        <Card as="ul" padding="none" className="divide-y divide-stone-100">
          {loaderData.messages.map((m) => (
            <li key={m.id}>
              <Link to={`/dev/mail/${m.id}`} className="block px-3 py-3 hover:bg-bay-50">
                <span className="font-semibold">{m.subject}</span>{" "}
                <span className="text-sm text-stone-600">
                  to {m.to} · {m.date}
                </span>
              </Link>
            </li>
          ))}
        </Card>
      )}
    </div>
  );
}

export function meta() {
  return [{ title: "Local mail — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
