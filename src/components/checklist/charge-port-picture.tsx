// A car seen from above, front at the top, with the chosen charging socket marked. It only
// illustrates the radio buttons beside it, so it is hidden from screen readers.
const SPOTS: Record<string, [number, number]> = {
  'front-left': [40, 30],
  'front-centre': [60, 16],
  'front-right': [80, 30],
  'side-left': [31, 118],
  'side-right': [89, 118],
  'rear-left': [42, 160],
  'rear-right': [78, 160],
};

/** @example <ChargePortPicture position="rear-left" /> */
export function ChargePortPicture({ position }: { position: string }) {
  return (
    <svg viewBox="0 0 120 190" className="sticky top-4 h-40 w-[6.3rem] shrink-0 sm:h-48 sm:w-[7.6rem]" aria-hidden="true" focusable="false">
      <text x="60" y="8" textAnchor="middle" fontSize="9" fill="#34635d" fontWeight="600">
        FRONT
      </text>
      <rect x="32" y="14" width="56" height="152" rx="22" fill="#f2f7f6" stroke="#5f988f" strokeWidth="2" />
      <path d="M40 52 Q60 42 80 52 L77 70 Q60 64 43 70 Z" fill="#dcebe8" stroke="#8dbab2" />
      <path d="M43 128 Q60 133 77 128 L79 142 Q60 148 41 142 Z" fill="#dcebe8" stroke="#8dbab2" />
      <rect x="26" y="40" width="6" height="22" rx="2" fill="#8dbab2" />
      <rect x="88" y="40" width="6" height="22" rx="2" fill="#8dbab2" />
      <rect x="26" y="124" width="6" height="22" rx="2" fill="#8dbab2" />
      <rect x="88" y="124" width="6" height="22" rx="2" fill="#8dbab2" />
      <text x="60" y="186" textAnchor="middle" fontSize="9" fill="#34635d" fontWeight="600">
        BACK
      </text>
      {Object.entries(SPOTS).map(([spot, [x, y]]) =>
        spot === position ? (
          <g key={spot}>
            <circle cx={x} cy={y} r="9" fill="#c26d33" opacity="0.25" />
            <circle cx={x} cy={y} r="6" fill="#c26d33" stroke="#fff" strokeWidth="2" />
          </g>
        ) : (
          <circle key={spot} cx={x} cy={y} r="4" fill="#fff" stroke="#8dbab2" strokeWidth="1.5" />
        ),
      )}
    </svg>
  );
}
