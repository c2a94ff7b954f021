// Where a user's certificate uploads live: the only keys a calibration form of theirs may name.

const prefix = (userId: number) => `uploads/certificates/${userId}/`;

export const certificateUploadPrefix = prefix;

export const isOwnCertificateUpload = (userId: number, key: string) =>
  key.startsWith(prefix(userId)) && /^[A-Za-z0-9_-]{16,40}$/.test(key.slice(prefix(userId).length));
