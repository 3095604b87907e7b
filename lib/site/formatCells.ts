export { signedSignificant } from "../format/index.ts";

const superscriptDigits = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const subscriptDigits = "₀₁₂₃₄₅₆₇₈₉";

/** A species label as chemists write it: 12C16O → ¹²C¹⁶O (plain text, no markup needed). */
export function speciesDisplay(label: string): string {
  // A mass number stands before its element; a single digit right after an element that is not
  // followed by a lowercase letter is an atom count (12C2H2 → ¹²C₂H₂, 12C16O2 → ¹²C¹⁶O₂).
  return label.replace(/(\d+)/g, (digits, _match, offset: number) => {
    const afterElement = offset > 0 && /[A-Za-z]/.test(label[offset - 1]);
    const count = afterElement && digits.length === 1;
    return [...digits].map((d) => (count ? subscriptDigits : superscriptDigits)[Number(d)]).join("");
  });
}
