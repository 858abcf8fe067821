import type { Metadata } from "next";
import localFont from "next/font/local";
import { DemoMarker } from "./_components/demo-marker";
import { SkipLink } from "./_components/skip-link";
import "./globals.css";

// Inter ships inside the app from its npm package; nothing is fetched at build or run time.
const sans = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
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
