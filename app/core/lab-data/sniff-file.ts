/**
 * What kind of file is this? Decided from the bytes (magic numbers, text decoding), with the file name
 * only as a hint. Pure: works on a Uint8Array.
 */
type SniffResult =
  | { readonly kind: "zip" }
  | {
      readonly kind: "text";
      readonly text: string;
      readonly encoding: "utf-8" | "utf-16" | "windows-1252";
    }
  | {
      readonly kind: "binary";
      readonly what: string;
      readonly offset?: number;
      readonly byte?: number;
    };

const SIGNATURES: ReadonlyArray<readonly [readonly number[], string]> = [
  [
    [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1],
    "an old-style Excel 97–2003 (.xls) or other OLE2 document",
  ],
  [[0x25, 0x50, 0x44, 0x46], "a PDF document"],
  [[0x89, 0x50, 0x4e, 0x47], "a PNG image"],
  [[0xff, 0xd8, 0xff], "a JPEG image"],
  [[0x47, 0x49, 0x46, 0x38], "a GIF image"],
  [[0x1f, 0x8b], "a gzip archive"],
  [[0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c], "a 7-Zip archive"],
  [[0x52, 0x61, 0x72, 0x21], "a RAR archive"],
  [[0x7f, 0x45, 0x4c, 0x46], "an executable program"],
  [[0x4d, 0x5a], "an executable program"],
];

function startsWith(bytes: Uint8Array, prefix: readonly number[]): boolean {
  if (bytes.length < prefix.length) return false;
  return prefix.every((b, i) => bytes[i] === b);
}

/** The byte offset of the first control character that text files do not contain, or -1. */
function firstControlChar(text: string): number {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (
      (c < 0x20 && c !== 0x09 && c !== 0x0a && c !== 0x0d && c !== 0x0c) ||
      (c >= 0x7f && c <= 0x9f)
    )
      return i;
  }
  return -1;
}

function decode(encoding: string, bytes: Uint8Array): string | null {
  try {
    return new TextDecoder(encoding, { fatal: true, ignoreBOM: false }).decode(
      bytes,
    );
  } catch {
    return null;
  }
}

export function sniffFile(bytes: Uint8Array): SniffResult {
  if (
    startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) ||
    startsWith(bytes, [0x50, 0x4b, 0x05, 0x06])
  ) {
    return { kind: "zip" };
  }
  for (const [signature, what] of SIGNATURES) {
    if (startsWith(bytes, signature)) return { kind: "binary", what };
  }

  let text: string | null = null;
  let encoding: "utf-8" | "utf-16" | "windows-1252" = "utf-8";
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff])) {
    // Excel's "Unicode text" export: UTF-16 with a byte-order mark (the decoder strips it).
    text = decode(bytes[0] === 0xff ? "utf-16le" : "utf-16be", bytes);
    encoding = "utf-16";
  } else {
    // UTF-8, with or without BOM (the decoder strips a BOM).
    text = decode("utf-8", bytes);
    if (text === null) {
      // Not UTF-8: Excel's plain "CSV" on Western-European Windows writes Windows-1252 ("°" as 0xB0).
      text = decode("windows-1252", bytes);
      encoding = "windows-1252";
    }
  }
  if (text === null) return { kind: "binary", what: "not readable as text" };
  const bad = firstControlChar(text);
  if (bad >= 0) {
    return {
      kind: "binary",
      what: "contains control characters that text files do not have",
      offset: bad,
      byte: text.charCodeAt(bad),
    };
  }
  return { kind: "text", text: text.replace(/^\uFEFF/, ""), encoding };
}

/** The file name's extension in lower case, without the dot ("" when none). */
export function extensionOf(filename: string): string {
  const base = filename.split(/[\\/]/).pop() ?? "";
  const dot = base.lastIndexOf(".");
  return dot > 0 ? base.slice(dot + 1).toLowerCase() : "";
}

export const TEXT_EXTENSIONS: readonly string[] = ["csv", "tsv", "txt"];
export const WORKBOOK_EXTENSIONS: readonly string[] = ["xlsx", "xlsm"];

/**
 * A light look at a ZIP archive's central directory, before the workbook reader inflates anything:
 * the file names it holds and the sum of their declared uncompressed sizes (a guard against zip bombs).
 * Returns null when the directory cannot be found.
 */
export function zipDirectory(
  bytes: Uint8Array,
): { names: string[]; uncompressedBytes: number } | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const minEocd = 22;
  if (bytes.length < minEocd) return null;
  let eocd = -1;
  const stop = Math.max(0, bytes.length - minEocd - 0xffff);
  for (let i = bytes.length - minEocd; i >= stop; i--) {
    if (view.getUint32(i, true) === 0x06054b50) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) return null;
  const entries = view.getUint16(eocd + 10, true);
  const dirSize = view.getUint32(eocd + 12, true);
  const dirOffset = view.getUint32(eocd + 16, true);
  if (dirOffset + dirSize > bytes.length) return null;
  const names: string[] = [];
  let total = 0;
  let at = dirOffset;
  const utf8 = new TextDecoder("utf-8");
  for (let n = 0; n < entries; n++) {
    if (at + 46 > bytes.length || view.getUint32(at, true) !== 0x02014b50)
      return null;
    const uncompressed = view.getUint32(at + 24, true);
    const nameLength = view.getUint16(at + 28, true);
    const extraLength = view.getUint16(at + 30, true);
    const commentLength = view.getUint16(at + 32, true);
    if (at + 46 + nameLength > bytes.length) return null;
    names.push(utf8.decode(bytes.subarray(at + 46, at + 46 + nameLength)));
    // 0xFFFFFFFF marks a ZIP64 size: treat it as too large rather than reading ZIP64 records.
    total +=
      uncompressed === 0xffffffff ? Number.POSITIVE_INFINITY : uncompressed;
    at += 46 + nameLength + extraLength + commentLength;
  }
  return { names, uncompressedBytes: total };
}
