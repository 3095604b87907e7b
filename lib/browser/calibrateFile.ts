// A chosen or dropped spectrum file, read here and never sent anywhere: its size checked before
// it is read (as the CLI does from stat), its bytes hashed (SHA-256, for the report) and decoded
// as UTF-8 the way Node's Buffer.toString does (a byte-order mark kept), so the reader sees the
// same text as on the command line.
import { checkSpectrumFileSize } from "../spectrumFile/index.ts";

export interface LoadedFile {
  name: string;
  text: string;
  sha256: string;
}

function hex(buffer: ArrayBuffer): string {
  return Array.from(new Uint8Array(buffer), (b) => b.toString(16).padStart(2, "0")).join("");
}

export async function loadSpectrumFile(file: File): Promise<LoadedFile> {
  checkSpectrumFileSize(file.name, file.size);
  const bytes = await file.arrayBuffer();
  // crypto.subtle exists only on https:// and localhost pages (a secure context).
  if (!globalThis.crypto?.subtle) throw new Error("this browser offers no SHA-256 here (the page must be served over https or from localhost)");
  const digest = await crypto.subtle.digest("SHA-256", bytes);
  return { name: file.name, text: new TextDecoder("utf-8", { ignoreBOM: true }).decode(bytes), sha256: hex(digest) };
}
