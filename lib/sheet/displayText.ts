// Every string from a molecule file is untrusted: the sheet only ever draws it as text. Control
// characters and bidirectional overrides are replaced so a file cannot break the layout or make
// one number read as another (Unicode TR36, "bidirectional text spoofing").
const controls = /[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

export function displayText(value: string): string {
  return value.replace(controls, " ").replace(/ {2,}/g, " ").trim();
}

/** The address if it is a well-formed http(s) URL, else null: only those become links. */
export function safeLink(url: string | null | undefined): string | null {
  if (!url) return null;
  try {
    const parsed = new URL(url.trim());
    return parsed.protocol === "http:" || parsed.protocol === "https:" ? parsed.href : null;
  } catch {
    return null;
  }
}
