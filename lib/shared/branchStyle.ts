import type { Branch } from "../core/index.ts";

/**
 * Branch styling of every plot (web and sheet). A dark orange and a mid blue stay apart for the
 * common colour-vision deficiencies (they differ mainly in blue–yellow and in lightness, which
 * protan and deutan viewers keep); the marker shape and the stick pattern repeat the distinction
 * for black-and-white print.
 */
export const branchStyle: Record<Branch, { name: string; colour: string; shape: string; dash: number[] }> = {
  P: { name: "P branch (ΔJ = −1)", colour: "#b4530a", shape: "triangle-down", dash: [3, 2] },
  R: { name: "R branch (ΔJ = +1)", colour: "#1f5fa6", shape: "circle", dash: [1, 0] },
};

export const bandOriginColour = "#444444";
