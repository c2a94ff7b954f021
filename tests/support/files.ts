// Tiny files with real magic numbers, made here rather than shipped.

/** An ISO base-media file: an `ftyp` box (brand isom) and an empty `mdat`, as mp4 starts. */
export function tinyMp4(extra = 2048): Buffer {
  const ftyp = Buffer.concat([
    Buffer.from([0, 0, 0, 0x20]),
    Buffer.from("ftypisom"),
    Buffer.from([0, 0, 2, 0]),
    Buffer.from("isomiso2avc1mp41"),
  ]);
  const payload = Buffer.alloc(extra, 0x11);
  const mdat = Buffer.concat([Buffer.from([0, 0, (extra + 8) >> 8, (extra + 8) & 0xff]), Buffer.from("mdat"), payload]);
  return Buffer.concat([ftyp, mdat]);
}

/** A Windows executable's header (MZ … PE), to be renamed .mp4 by a hostile client. */
export function fakeExecutable(): Buffer {
  const b = Buffer.alloc(1024, 0);
  b.write("MZ", 0, "latin1");
  b.writeUInt32LE(0x80, 0x3c);
  b.write("PE\0\0", 0x80, "latin1");
  return b;
}

/** A 1×1 PNG. */
export const tinyPng = () =>
  Buffer.from(
    "89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6300010000050001" +
      "0d0a2db40000000049454e44ae426082",
    "hex",
  );
