"use client";
import dynamic from "next/dynamic";

// The quarantine week's forms (react-hook-form and two zod schemas, about 30 KB gzipped) load only on a reservation
// in its quarantine week, still rendered on the server; the page in its other states does not carry them.
export const QuarantinePanel = dynamic(() => import("./quarantine-panel").then((m) => m.QuarantinePanel));
