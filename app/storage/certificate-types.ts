// What may be attached as a rig's calibration certificate (a PDF, or a scan or photo of it), shared
// by the uploader in the browser and the server checks.

export const CERTIFICATE_TYPES = {
  "application/pdf": "PDF",
  "image/png": "PNG",
  "image/jpeg": "JPEG",
} as const;

export type CertificateType = keyof typeof CERTIFICATE_TYPES;

export const isCertificateType = (t: string): t is CertificateType => Object.hasOwn(CERTIFICATE_TYPES, t);

export const MAX_CERTIFICATE_BYTES = 10 * 1024 * 1024;
