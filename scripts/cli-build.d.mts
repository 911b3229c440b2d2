// Types of scripts/cli-build.mjs for the TypeScript that imports it (tests).
export const ROOT: string;
export const CLI_BUILD: string;
export function cliBuildIsFresh(): boolean;
export function buildCli(): Promise<void>;
