import type { Config } from "tailwindcss";

// Ratecourt's look: calm slate ground, a deep teal accent, verdict colours that also differ by shape.
export default {
  content: ["./app/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
      },
      colors: {
        // Text in ink, soft or muted (secondary text: 4.5:1 or more on every paper colour); faint is
        // for borders and rules only, never for text (it reads at about 3:1).
        ink: { DEFAULT: "#1c2430", soft: "#4a5568", muted: "#5d6878", faint: "#8a94a6" },
        paper: { DEFAULT: "#f7f8fa", raised: "#ffffff", sunk: "#eef1f5" },
        accent: { DEFAULT: "#0f5e6b", soft: "#dcefF1", strong: "#0a434c" },
        verdict: {
          impossible: "#b42318",
          // 5.0:1 or more on white, paper and the sunk grey (WCAG AA for small text); was #b26a00 at 3.7-4.2:1.
          evidence: "#955800",
          plausible: "#1f7a3a",
        },
      },
    },
  },
} satisfies Config;
