// The invented demo scenario. No real shops, people, brands or vehicle models.
export const DEMO_PASSWORD = "demo-gusset-2026";
export const DEMO_PIN = "2468";

export const DEMO_SHOPS = [
  {
    slug: "iron-gully",
    name: "Iron Gully 4x4 Fabrication",
    continuityCode: "aws-d1.1" as const,
    people: [
      { email: "lead@irongully.example", name: "Nell Corrigan", roles: ["lead"] },
      { email: "welder@irongully.example", name: "Mick Tamsin", roles: ["welder"] },
      { email: "welder2@irongully.example", name: "Priya Okafor", roles: ["welder", "inspector"] },
      { email: "inspector@irongully.example", name: "Ines Lindqvist", roles: ["inspector"] },
      { email: "auditor@irongully.example", name: "Theo Marsh", roles: ["auditor"] },
    ],
  },
  {
    slug: "saltpan",
    name: "Saltpan Chassis & Axle",
    continuityCode: "asme-ix" as const,
    people: [
      { email: "lead@saltpan.example", name: "Jo Vantreight", roles: ["lead"] },
      { email: "welder@saltpan.example", name: "Kit Amberley", roles: ["welder"] },
      // An insurer's auditor who reads both shops' records: shows the shop switcher.
      { email: "auditor@irongully.example", name: "Theo Marsh", roles: ["auditor"] },
    ],
  },
] as const;
