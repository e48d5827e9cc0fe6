/**
 * UTF-8 bytes → string for header, metadata and message text only (the data path never
 * decodes text). shared/ has no TextDecoder type, and the few bytes involved do not need one.
 * Invalid sequences become U+FFFD, as a decoder in replacement mode would give.
 */
export function decodeUtf8(bytes: Uint8Array, start = 0, end = bytes.length): string {
  let out = '';
  let i = start;
  while (i < end) {
    const b0 = bytes[i]!;
    if (b0 < 0x80) {
      out += String.fromCharCode(b0);
      i++;
      continue;
    }
    let need: number;
    let cp: number;
    let min: number;
    if (b0 >= 0xc2 && b0 <= 0xdf) {
      need = 1;
      cp = b0 & 0x1f;
      min = 0x80;
    } else if (b0 >= 0xe0 && b0 <= 0xef) {
      need = 2;
      cp = b0 & 0x0f;
      min = 0x800;
    } else if (b0 >= 0xf0 && b0 <= 0xf4) {
      need = 3;
      cp = b0 & 0x07;
      min = 0x10000;
    } else {
      out += '\ufffd';
      i++;
      continue;
    }
    let j = 1;
    for (; j <= need && i + j < end; j++) {
      const b = bytes[i + j]!;
      if ((b & 0xc0) !== 0x80) break;
      cp = (cp << 6) | (b & 0x3f);
    }
    if (j <= need || cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) {
      out += '\ufffd';
      i += Math.max(1, j);
      continue;
    }
    out += String.fromCodePoint(cp);
    i += need + 1;
  }
  return out;
}
