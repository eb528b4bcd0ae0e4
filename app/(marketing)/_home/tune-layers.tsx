/*
 * A notation-free picture of the stages: the same melody contour drawn four times, each row
 * adding one more family of embellishment marks. The words live in the list, not the SVG.
 */
const NOTES = [34, 26, 30, 20, 24, 34, 28, 38]; // y of each note; smaller is higher
const X0 = 14;
const STEP = 28;
const x = (i: number) => X0 + i * STEP;

const STAGES = [
  { title: "Core melody", detail: "the bare tune, same bars, same length" },
  { title: "+ Bowing", detail: "slurs that shape the phrases" },
  { title: "+ Ornaments and fills", detail: "rolls, grace notes, slides, triplets" },
  { title: "Full setting", detail: "double stops, dynamics, accents" },
];

function Strip({ stage }: { stage: number }) {
  const line = NOTES.map((y, i) => `${x(i)},${y}`).join(" ");
  return (
    <svg viewBox="0 -8 224 64" className="h-16 w-full max-w-56" aria-hidden="true" focusable="false">
      <polyline points={line} fill="none" stroke="#D9C8B0" strokeWidth="2" />
      {stage >= 2
        ? [0, 2, 4, 6].map((i) => (
            <path
              key={`s${i}`}
              d={`M${x(i)} ${NOTES[i] - 8} Q${x(i) + STEP / 2} ${Math.min(NOTES[i], NOTES[i + 1]) - 20} ${x(i + 1)} ${NOTES[i + 1] - 8}`}
              fill="none"
              stroke="#8A3B12"
              strokeWidth="1.6"
              strokeLinecap="round"
            />
          ))
        : null}
      {stage >= 3 ? (
        <g fill="#8A3B12">
          <path d={`M${x(3) - 6} -2 q3 -4 6 0 t6 0`} fill="none" stroke="#8A3B12" strokeWidth="1.6" />
          <circle cx={x(1) + STEP / 2} cy={(NOTES[1] + NOTES[2]) / 2} r="2.6" />
          <circle cx={x(5) + STEP / 2} cy={(NOTES[5] + NOTES[6]) / 2} r="2.6" />
        </g>
      ) : null}
      {stage >= 4 ? (
        <g>
          <circle cx={x(0)} cy={NOTES[0] + 10} r="4.2" fill="none" stroke="#24190F" strokeWidth="1.6" />
          <circle cx={x(7)} cy={NOTES[7] - 10} r="4.2" fill="none" stroke="#24190F" strokeWidth="1.6" />
          <path d="M150 50 L196 46 M150 50 L196 54" stroke="#2F5D3A" strokeWidth="1.6" strokeLinecap="round" />
        </g>
      ) : null}
      {NOTES.map((y, i) => (
        <circle key={i} cx={x(i)} cy={y} r="4.2" fill="#24190F" />
      ))}
    </svg>
  );
}

export function TuneLayers() {
  return (
    <figure className="rounded-knot border border-line bg-paper p-4 shadow-[0_2px_0_0_#D9C8B0] sm:p-6">
      <figcaption className="mb-3 font-serif text-h4 font-semibold">One tune, four versions</figcaption>
      <ol className="flex flex-col divide-y divide-line">
        {STAGES.map((s, i) => (
          <li
            key={s.title}
            className="grid grid-cols-[2rem_1fr] items-center gap-x-3 gap-y-1 py-2.5 sm:grid-cols-[2rem_1fr_14rem]"
          >
            <span
              aria-hidden="true"
              className="flex h-8 w-8 items-center justify-center rounded-full bg-walnut text-small font-semibold text-rosin"
            >
              {i + 1}
            </span>
            <span>
              <span className="sr-only">Stage {i + 1}: </span>
              <span className="block font-semibold">{s.title}</span>
              <span className="block text-small text-bark">{s.detail}</span>
            </span>
            <span className="col-start-2 sm:col-start-3 sm:row-start-1">
              <Strip stage={i + 1} />
            </span>
          </li>
        ))}
      </ol>
    </figure>
  );
}
