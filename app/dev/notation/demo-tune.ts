// A reel written for this development page (not a traditional tune): two parts, slurs, rolls,
// a grace note, triplets, a double stop and a dynamic, with exact and near twins for the phrase map.
export const DEMO_TUNE = `X:1
T:The Cedar Stair
R:reel
M:4/4
L:1/8
Q:1/4=100
K:D
P:A
|:"D"!mf!A2 (FA) ~d2 fd|"G"B2 (GB) "A"AFED|"D"A2 (FA) ~d2 fd|"G"B2 (GB) "A"AFEF|
"D"A2 (FA) ~d2 fd|"G"B2 (GB) "A"AFED|"G"(3Bcd "A"ef ge ce|"D"d2 f2 [Ad]4:|
P:B
|:"D"fa (af) ~g2 fg|"A"(3agf ef "D"d2 AF|"D"fa (af) ~g2 fg|"A"(3agf ef e2 dc|
"D"fa (af) {a}g2 fg|"A"(3agf ef "D"d2 AF|"G"(3Bcd "A"ef ge ce|"D"d2 f2 [Ad]4:|
`;

export const DEMO_REASON = "Opens when your teacher signs off the stage before it.";

/** The stage a student has reached in this demo: later stages show as locked. */
export const DEMO_OPEN_STAGES = 3;

export function devPagesOn(): boolean {
  return process.env.NODE_ENV !== "production" || process.env.DEMO_DEV_PAGES === "true";
}
