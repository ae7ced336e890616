/** Public sections shown in the main navigation; each entry is a page that exists. */
export const PUBLIC_NAV: { href: string; label: string }[] = [
  { href: "/map", label: "Find nearby" },
  { href: "/#how-it-works", label: "How it works" },
  { href: "/planner", label: "Plan a tank" },
  { href: "/safety", label: "Safety" },
];
