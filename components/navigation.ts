/** The product's areas, in the order an astronomer meets them while preparing a proposal. */
export const primaryNavigation = [
  { href: "/bench", label: "Lens bench" },
  { href: "/proposals", label: "Proposals" },
  { href: "/sky", label: "Sky windows" },
  { href: "/references", label: "References" },
] as const;
