/** What a command gives back to whoever runs it (the CLI prints the output and exits with the code). */
export interface CommandResult {
  output: string;
  exitCode: number;
}
