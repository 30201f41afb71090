import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import "./globals.css";

const inter = localFont({
  src: [
    { path: "../fonts/Inter_400Regular.ttf", weight: "400", style: "normal" },
    { path: "../fonts/Inter_600SemiBold.ttf", weight: "600", style: "normal" },
    { path: "../fonts/Inter_700Bold.ttf", weight: "700", style: "normal" },
  ],
  variable: "--font-inter",
  display: "swap",
});

const mono = localFont({
  src: [{ path: "../fonts/DejaVuSansMono.ttf", weight: "400", style: "normal" }],
  variable: "--font-mono",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Loomwright", template: "%s · Loomwright" },
  description:
    "Cut lists, electrical checks, spool plans and traceable markers for low-voltage DC harnesses.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#1d2433" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${inter.variable} ${mono.variable}`}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
