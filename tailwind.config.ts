import type { Config } from "tailwindcss";

// Tailwind v4 reads its theme from app/globals.css (@theme); this file names the content roots
// and is loaded there with @config so editors and the build agree on one source.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lessons/**/*.{ts,tsx}"],
};

export default config;
