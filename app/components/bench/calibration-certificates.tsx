// Each calibration of a rig with its certificate, for the rig's owner and moderators (the route
// decides who gets the list; the certificate route checks again).
import { formatDate } from "~/domain/format";
import { Card } from "../ui";

export interface CertificateEntry {
  id: number;
  calibratedOn: string;
  verified: boolean;
  hasCertificate: boolean;
}

export function CalibrationCertificates({ rigId, certificates }: { rigId: number; certificates: CertificateEntry[] }) {
  return (
    <Card as="section" aria-labelledby="calibration-certificates" className="space-y-2">
      <h2 id="calibration-certificates" className="font-semibold">
        Calibration certificates
      </h2>
      <p className="text-sm text-stone-600">Only the rig&apos;s owner and moderators see these.</p>
      <ul className="space-y-1 text-sm">
        {certificates.map((c) => (
          <li key={c.id} className="flex min-h-11 flex-wrap items-center gap-x-3 border-t border-stone-100 pt-1">
            <span>
              Calibration of {formatDate(c.calibratedOn)} ({c.verified ? "verified" : "not yet verified"}):
            </span>
            {c.hasCertificate ? (
              <a
                href={`/bench/rigs/${rigId}/calibrations/${c.id}/certificate`}
                className="inline-flex min-h-11 items-center text-bay-700 underline"
                aria-label={`Certificate of the calibration of ${formatDate(c.calibratedOn)}`}
              >
                Certificate
              </a>
            ) : (
              <span className="text-stone-600">no certificate attached</span>
            )}
          </li>
        ))}
      </ul>
    </Card>
  );
}
