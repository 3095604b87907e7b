#!/usr/bin/env node
// Entry point of the `bandatlas` command: TypeScript sources run through tsx's loader.
import { register } from "tsx/esm/api";

register();
await import("../lib/cli/run.ts");
