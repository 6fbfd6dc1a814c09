// The fictional school the demo seed creates. Every name here is invented; the addresses use the
// reserved .example domain (RFC 2606), so no message can reach a real inbox.

export const demoPassword = "edgewise-demo";

export const demoSchool = { slug: "fernhallow", name: "Fernhallow Trades College" } as const;

const domain = "fernhallow.example";

export const demoAdmin = { name: "Noor Whitcombe", email: `admin@${domain}` } as const;

export const demoCohorts = [
  {
    name: "Data lines — autumn evenings",
    courseSlug: "data-runs",
    startsOn: "2026-10-05",
    endsOn: "2027-01-22",
    instructor: { name: "Tomasz Brennholt", email: `tomasz.brennholt@${domain}` },
    learners: [
      "Priya Castellanos",
      "Emeka Thorvaldsen",
      "Hana Kowalczyk",
      "Mateo Ashgrove",
      "Siobhan Nakamura",
      "Dmitri Osei",
    ],
  },
  {
    name: "Data lines — winter days",
    courseSlug: "data-runs",
    startsOn: "2026-11-09",
    endsOn: "2027-02-26",
    instructor: { name: "Adaeze Lindqvist", email: `adaeze.lindqvist@${domain}` },
    learners: [
      "Lucía Penhallow",
      "Tariq Lindgren",
      "Mei-Lin Oyelaran",
      "Jonas Adebayo-Strand",
      "Freya Montalvo",
      "Kwame Rasmussen",
    ],
  },
] as const;

export function demoLearnerEmail(name: string): string {
  const local = name
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z]+/g, ".")
    .replace(/^\.|\.$/g, "");
  return `${local}@${domain}`;
}
