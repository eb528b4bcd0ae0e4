// Invented people of the invented demo school. Any likeness to real persons is chance.
export const SCHOOL_NAME = "Larchmoor Fiddle School";
export const DEMO_PASSWORD = "rosin-and-bow-2026";

export const ADMIN = { name: "Maren Ashdown", email: "admin@larchmoor.example" };

export const TEACHERS = [
  { name: "Isla Penhallow", email: "isla@larchmoor.example" },
  { name: "Tomas Greavey", email: "tomas@larchmoor.example" },
  { name: "Ruth Callander", email: "ruth@larchmoor.example" },
];

const FIRST = [
  "Alder",
  "Bryony",
  "Cathal",
  "Delphine",
  "Emrys",
  "Fenella",
  "Gideon",
  "Hester",
  "Ivo",
  "Juno",
  "Kester",
  "Linnea",
  "Morwen",
  "Niall",
  "Orla",
  "Perrin",
  "Quilla",
  "Rhodri",
  "Sabine",
  "Tamsin",
  "Ulric",
  "Verity",
  "Wren",
  "Xanthe",
  "Yorick",
  "Zinnia",
  "Anselm",
  "Briar",
  "Corin",
  "Dagny",
  "Elspeth",
  "Florin",
];
const LAST = [
  "Thistlewood",
  "Marrable",
  "Quenby",
  "Holloway-Pike",
  "Dunsmore",
  "Featherstane",
  "Corrigall",
  "Ashwell",
  "Brackenbury",
  "Tredinnick",
  "Gallacher-Voss",
  "Penrose-Lyle",
  "Whitlow",
  "Strachan",
  "Merriday",
  "Oakhanger",
];

/** 32 invented students, each with a stable address, spread over the three teachers. */
export const STUDENTS = FIRST.map((first, i) => {
  const last = LAST[(i * 5) % LAST.length];
  return {
    name: `${first} ${last}`,
    email: `${first.toLowerCase()}.${last.toLowerCase().replace(/[^a-z]/g, "")}@students.example`,
    teacherIndex: i % TEACHERS.length,
    timeZone: ["Europe/London", "America/Halifax", "Europe/Dublin", "Australia/Hobart"][i % 4],
  };
});
