import { parseArgs, type ParseArgsConfig } from "node:util";
import { UsageError } from "./usageError.ts";

export type OptionSpec = NonNullable<ParseArgsConfig["options"]>;

/** parseArgs with messages a person can act on instead of Node's error codes. */
export interface ParsedCommandLine {
  values: Record<string, string | boolean | undefined>;
  positionals: string[];
}

export function parseCommandLine(command: string, args: string[], options: OptionSpec, maxPositionals: number): ParsedCommandLine {
  let parsed: ParsedCommandLine;
  // "--temperature -5" would otherwise be read as an unknown option "-5": join a value that looks
  // like a negative number to its option, so the range check can say what is wrong with it.
  const joined: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const name = args[i].startsWith("--") ? args[i].slice(2) : null;
    if (name && options[name]?.type === "string" && i + 1 < args.length && /^-[\d.]/.test(args[i + 1])) {
      joined.push(`${args[i]}=${args[i + 1]}`);
      i++;
    } else joined.push(args[i]);
  }
  try {
    parsed = parseArgs({
      args: joined,
      options: { ...options, help: { type: "boolean", short: "h" } },
      allowPositionals: true,
      strict: true,
    }) as ParsedCommandLine;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const unknown = /Unknown option '([^']+)'/.exec(message);
    if (unknown) throw new UsageError(`unknown option ${unknown[1]} for \`bandatlas ${command}\` (see bandatlas ${command} --help)`);
    const missing = /Option '([^']+?)(?: <value>)?' argument missing/.exec(message);
    if (missing) throw new UsageError(`option ${missing[1]} needs a value (see bandatlas ${command} --help)`);
    throw new UsageError(`${message.replace(/\. To specify.*$/, "")} (see bandatlas ${command} --help)`);
  }
  if (parsed.positionals.length > maxPositionals) {
    throw new UsageError(
      `too many arguments for \`bandatlas ${command}\`: ${parsed.positionals.slice(maxPositionals).join(" ")} (see bandatlas ${command} --help)`,
    );
  }
  return parsed;
}

export function numberOption(name: string, text: string | undefined, fallback: number, unit = ""): number {
  if (text === undefined) return fallback;
  const cleaned = unit ? text.trim().replace(new RegExp(`\\s*${unit}$`, "i"), "") : text.trim();
  const value = cleaned === "" ? NaN : Number(cleaned);
  if (!Number.isFinite(value)) throw new UsageError(`--${name} expects a number${unit ? ` in ${unit}` : ""}, got "${text}"`);
  return value;
}

export function temperatureOption(text: string | undefined, fallback: number): number {
  const t = numberOption("temperature", text, fallback, "K");
  if (!(t > 0)) throw new UsageError(`--temperature ${text}: a temperature must be above 0 K`);
  if (t > 10000) throw new UsageError(`--temperature ${text}: above 10 000 K the molecules are dissociated and the model means nothing`);
  return t;
}

export function formatOption(text: string | undefined, allowed: string[]): string {
  const format = text ?? allowed[0];
  if (!allowed.includes(format)) throw new UsageError(`--format ${format} is not one of: ${allowed.join(", ")}`);
  return format;
}
