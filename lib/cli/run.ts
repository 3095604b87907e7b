import { runCli } from "./main.ts";

const { stdout, stderr, exitCode } = await runCli(process.argv.slice(2));
process.stdout.on("error", () => process.exit(exitCode));
if (stdout) process.stdout.write(stdout);
if (stderr) process.stderr.write(stderr);
process.exitCode = exitCode;
