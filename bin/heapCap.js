// The build keeps only small tables from one batch of molecules to the next: its live heap stays
// near 100 MB whatever the size of the atlas (bench: `npx tsx bench/run.ts scale`). V8, left to
// itself, sizes its heap to the garbage a long run leaves, so the peak still grew with the atlas
// (693 MB at 50 invented molecules, 842 MB at 500, 1174 MB at 2000). A cap on the old generation
// makes it collect instead: 464 MB at 50 and 501 MB at 500. 512 MB leaves the largest batch
// (16 molecules, 250 species pages in one Eleventy run, ~170 MB at its peak) three times its room.
export const buildHeapCapMb = 512;

/** Commands that build the atlas, and so run under the cap. */
export const cappedCommands = ["build", "serve"];

/** Node's arguments for a capped run, unless the person running it already chose a heap size. */
export function heapCapArgs(execArgv, nodeOptions = "") {
  const chosen = [...execArgv, ...nodeOptions.split(/\s+/)].some((a) => a.startsWith("--max-old-space-size"));
  return chosen ? [] : [`--max-old-space-size=${buildHeapCapMb}`];
}
