import type { Metadata } from "next";
import localFont from "next/font/local";
import { DemoMarker } from "./_components/demo-marker";
import { SkipLink } from "./_components/skip-link";
import "./globals.css";

// Inter ships inside the app from its npm package, the one the memo PDF embeds too (lib/pdf/font.ts);
// nothing is fetched at build or run time. The weights are those the styles use: 400, 500
// (font-medium), 600 (font-semibold) and 700 (bold, as in a bare <strong>).
// next/font needs literal arguments, hence the four spelt-out files.
const sans = localFont({
  src: [
    { path: "../node_modules/@fontsource/inter/files/inter-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../node_modules/@fontsource/inter/files/inter-latin-500-normal.woff2", weight: "500", style: "normal" },
    { path: "../node_modules/@fontsource/inter/files/inter-latin-600-normal.woff2", weight: "600", style: "normal" },
    { path: "../node_modules/@fontsource/inter/files/inter-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-sans",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Ratecourt", template: "%s · Ratecourt" },
  description: "Tenders for radio modules, with every coding claim checked against the limits of channel coding.",
  icons: { icon: "/favicon.svg" },
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen font-sans">
        <SkipLink />
        {children}
        <DemoMarker />
      </body>
    </html>
  );
}
