export * from "./buildCache.ts";
export * from "./buildSite.ts";
export * from "./checkLinks.ts";
export * from "./swapDirectory.ts";
export * from "./bundleBrowser.ts";
export * from "./siteStats.ts";
