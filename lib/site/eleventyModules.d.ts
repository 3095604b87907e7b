// Eleventy and its plugins ship no type declarations; they are used through a few calls only.
declare module "@11ty/eleventy";
declare module "@11ty/eleventy-plugin-syntaxhighlight";
declare module "@11ty/eleventy-dev-server";
