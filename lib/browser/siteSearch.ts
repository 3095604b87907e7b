// The site's one script: name and wavenumber search on the home page. Loaded as an external file
// (the pages' Content-Security-Policy allows no inline script); everything it shows is written
// with textContent, never innerHTML.
import MiniSearch from "minisearch";
import { findColumns, findGroups, findHeadText, findPositionsNote, findUnknownStrengthHeading } from "../format/findText.ts";
import { parseSpectralPosition, positionToWavenumber, unitLabels, type PositionUnit, type SpectralPosition } from "../core/positions/spectralPosition.ts";
import { decodeLineIndex, type DecodedLineIndex, type LineIndexFile } from "../shared/lineIndexCodec.ts";
import { nameIndexOptions, nameSearchOptions } from "../shared/nameSearchOptions.ts";
import { searchWavenumber } from "./wavenumberSearch.ts";
import { lineRowId } from "../shared/sitePaths.ts";
import { findWindowCm } from "../atlas/atlasConfig.ts";
import { el } from "./dom.ts";

const root = document.documentElement.dataset.root ?? "";

async function fetchJson<T>(path: string): Promise<T> {
  const response = await fetch(root + path);
  if (!response.ok) throw new Error(`could not load ${path} (${response.status})`);
  return (await response.json()) as T;
}

function show(output: HTMLElement, ...nodes: Node[]) {
  output.replaceChildren(...nodes);
}

function setupNameSearch(form: HTMLFormElement) {
  const output = document.getElementById(form.dataset.output!)!;
  const input = form.elements.namedItem("q") as HTMLInputElement;
  let index: Promise<MiniSearch> | null = null;
  const load = () => (index ??= fetchJson<object>(form.dataset.index!).then((json) => MiniSearch.loadJS(json as never, nameIndexOptions)));
  const run = async () => {
    const query = input.value.trim();
    if (!query) return show(output, el("p", "Type a name, formula, alias or CAS number."));
    try {
      const results = (await load()).search(query, nameSearchOptions);
      if (!results.length) return show(output, el("p", `No molecule matches “${query}”.`));
      const list = el("ul");
      for (const r of results) {
        const item = el("li");
        item.append(el("a", `${r.name} (${r.formula})`, { href: root + r.path }), ` — CAS ${r.casNumber}`);
        list.append(item);
      }
      show(output, el("p", `${results.length} molecule${results.length === 1 ? "" : "s"} match “${query}”:`), list);
    } catch (error) {
      show(output, el("p", `Search failed: ${(error as Error).message}`, { class: "error" }));
    }
  };
  form.addEventListener("submit", (event) => {
    event.preventDefault();
    history.replaceState(null, "", `?q=${encodeURIComponent(input.value.trim())}#search`);
    void run();
  });
  const initial = new URLSearchParams(location.search).get("q");
  if (initial !== null) {
    input.value = initial;
    void run();
  }
}

function setupWavenumberSearch(form: HTMLFormElement) {
  const output = document.getElementById(form.dataset.output!)!;
  const field = (name: string) => form.elements.namedItem(name) as HTMLInputElement | HTMLSelectElement;
  const indexes = new Map<string, Promise<DecodedLineIndex>>();
  const load = (token: string) => {
    let index = indexes.get(token);
    if (!index) {
      const option = (field("temperature") as HTMLSelectElement).querySelector(`option[value="${CSS.escape(token)}"]`) as HTMLOptionElement | null;
      if (!option) throw new Error(`no line index for ${token} K`);
      index = fetchJson<LineIndexFile>(option.dataset.index!).then(decodeLineIndex);
      indexes.set(token, index);
    }
    return index;
  };
  const fail = (message: string) => show(output, el("p", message, { class: "error", role: "alert" }));
  const run = async () => {
    const air = (field("air") as HTMLInputElement).checked;
    let position: SpectralPosition;
    try {
      position = parseSpectralPosition(field("wavenumber").value, field("unit").value as PositionUnit, air ? "air" : "vacuum");
    } catch (error) {
      return fail(`${(error as Error).message}.`);
    }
    const wavenumber = positionToWavenumber(position);
    // The CLI's rule (findWindowCm): an empty field is the default in cm⁻¹, a number is in the position's unit.
    const windowText = field("window").value.trim();
    const windowGiven = windowText === "" ? null : Number(windowText.replace(",", "."));
    const windowCm = windowGiven === null || windowGiven > 0 ? findWindowCm(position, windowGiven) : NaN;
    const minRelative = Number(field("minRelative").value.trim());
    const token = field("temperature").value;
    if (!(windowCm > 0) || windowCm > 500) return fail("The window (half-width) must be above 0 and at most 500 cm⁻¹ (in the position's unit).");
    if (!(minRelative < 1)) return fail("The minimum relative intensity must be below 1.");
    try {
      const index = await load(token);
      if (minRelative < index.minRelative)
        return fail(
          `The site's index holds lines down to ${index.minRelative} of their band's strongest line; for weaker lines use \`bandatlas find --min-relative\`.`,
        );
      const matches = searchWavenumber(index, wavenumber, windowCm, minRelative);
      const given = position.unit === "cm-1" ? "" : ` (${position.value} ${unitLabels[position.unit]}, ${position.medium})`;
      const head = el("p", findHeadText({ windowCm, wavenumber, given, temperatureK: index.temperatureK, minRelative, count: matches.length }));
      if (!matches.length) return show(output, head);
      const tableOf = (list: typeof matches) => {
        const table = el("table", undefined, { class: "lines compact" });
        const headRow = el("tr");
        for (const c of findColumns) headRow.append(el("th", c.heading, { scope: "col" }));
        table.append(el("thead"), el("tbody"));
        table.tHead!.append(headRow);
        for (const m of list) {
          const row = el("tr");
          for (const c of findColumns) {
            if (c.heading === "line") {
              // The line's name links to its row on the species page.
              const cell = el("td");
              cell.append(el("a", m.label, { href: `${root}${m.page}#${lineRowId(m.band, m.label)}` }));
              row.append(cell);
            } else row.append(el("td", c.cell(m), c.numeric ? { class: "num" } : undefined));
          }
          table.tBodies[0].append(row);
        }
        return table;
      };
      // As the CLI: lines of known strength first; those whose strength is unknown apart, said so.
      const groups = findGroups(matches);
      const parts: HTMLElement[] = [head];
      if (groups.known.length) parts.push(tableOf(groups.known));
      if (groups.unknown.length) parts.push(el("p", findUnknownStrengthHeading, { class: "hint find-unknown" }), tableOf(groups.unknown));
      parts.push(el("p", findPositionsNote, { class: "hint" }));
      show(output, ...parts);
    } catch (error) {
      fail(`Search failed: ${(error as Error).message}`);
    }
  };
  form.addEventListener("submit", (event) => {
    event.preventDefault();
    const params = new URLSearchParams();
    for (const name of ["wavenumber", "unit", "window", "temperature", "minRelative"]) params.set(name, field(name).value.trim());
    if ((field("air") as HTMLInputElement).checked) params.set("air", "1");
    history.replaceState(null, "", `?${params}#find`);
    void run();
  });
  const params = new URLSearchParams(location.search);
  if (params.has("wavenumber")) {
    for (const name of ["wavenumber", "unit", "window", "temperature", "minRelative"]) {
      const value = params.get(name);
      if (value !== null) field(name).value = value;
    }
    (field("air") as HTMLInputElement).checked = params.get("air") === "1";
    void run();
  }
}

for (const form of document.querySelectorAll<HTMLFormElement>("form[data-search]")) {
  if (form.dataset.search === "name") setupNameSearch(form);
  if (form.dataset.search === "wavenumber") setupWavenumberSearch(form);
}
