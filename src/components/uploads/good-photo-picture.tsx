// A small drawing of what a good photo for a slot looks like: the thing filling a phone's
// viewfinder, straight on, in good light. Our own inline SVG, no image files; the words beside it
// (goodPhotoAdvice) say the same for anyone who cannot see it, so the drawing is decorative.
import type { ReactNode } from 'react';
import type { UploadKind } from '@/lib/schemas/uploads';

const INK = '#1c302e';
const PANEL = '#eef0ed';

function Meter() {
  return (
    <>
      <rect x="52" y="14" width="56" height="86" rx="6" fill={PANEL} stroke={INK} strokeWidth="2.5" />
      <rect x="60" y="26" width="40" height="16" rx="2" fill="#9fb8a4" stroke={INK} strokeWidth="1.5" />
      <text x="80" y="38.5" fontSize="10" fontFamily="monospace" textAnchor="middle" fill={INK}>04712</text>
      <path d="M62 52h36M62 58h24" stroke={INK} strokeWidth="1.5" />
      <circle cx="80" cy="78" r="4" fill="#b3261e" />
    </>
  );
}

function Cutout() {
  return (
    <>
      <rect x="50" y="10" width="60" height="94" rx="5" fill="#6b706e" stroke={INK} strokeWidth="2.5" />
      <rect x="58" y="36" width="44" height="40" rx="4" fill="#a3a8a5" stroke={INK} strokeWidth="2" />
      <text x="80" y="62" fontSize="13" fontWeight="700" fontFamily="sans-serif" textAnchor="middle" fill={INK}>100 A</text>
      {/* the torch's light falling on the fuse carrier */}
      <path d="M150 4 L96 40 L110 78 Z" fill="#f5d76e" opacity="0.45" />
    </>
  );
}

function ConsumerUnit() {
  const ways = [0, 1, 2, 3, 4, 5];
  return (
    <>
      <rect x="18" y="34" width="124" height="52" rx="5" fill={PANEL} stroke={INK} strokeWidth="2.5" />
      {ways.map((i) => (
        <g key={i}>
          <rect x={28 + i * 18} y="44" width="12" height="24" rx="2" fill="#dfe3e0" stroke={INK} strokeWidth="1.2" />
          <rect x={31 + i * 18} y="49" width="6" height="9" fill="#2b504c" />
          <path d={`M${29 + i * 18} 76h10`} stroke={INK} strokeWidth="1.5" />
        </g>
      ))}
    </>
  );
}

function ChargerSpot() {
  return (
    <>
      <rect x="10" y="8" width="140" height="62" fill="#c98b63" />
      {[20, 32, 44, 56].map((y) => (
        <path key={y} d={`M10 ${y}h140`} stroke="#a8714f" strokeWidth="1.5" />
      ))}
      <rect x="56" y="24" width="28" height="26" fill="none" stroke="#fff" strokeWidth="2.5" strokeDasharray="5 3" />
      <rect x="10" y="70" width="140" height="40" fill="#8e8f8a" />
      <path d="M38 100 q4 -16 20 -18 h44 q16 2 20 18 z" fill="#3b5e58" />
      <circle cx="52" cy="101" r="5" fill={INK} />
      <circle cx="108" cy="101" r="5" fill={INK} />
    </>
  );
}

function Paper() {
  return (
    <>
      <rect x="44" y="10" width="72" height="96" fill="#ffffff" stroke={INK} strokeWidth="2" />
      {[24, 32, 40, 48, 56, 64].map((y, i) => (
        <path key={y} d={`M52 ${y}h${i === 0 ? 40 : 56}`} stroke={INK} strokeWidth={i === 0 ? 2.5 : 1.5} />
      ))}
      <path d="M52 90c6-6 10 4 16-2s8 2 14-2" stroke={INK} strokeWidth="1.5" fill="none" />
    </>
  );
}

function Anything() {
  return (
    <>
      <rect x="36" y="24" width="88" height="66" rx="8" fill={PANEL} stroke={INK} strokeWidth="2.5" />
      <circle cx="80" cy="57" r="16" fill="none" stroke={INK} strokeWidth="2.5" />
    </>
  );
}

const drawings: Record<UploadKind, () => ReactNode> = {
  meter_photo: Meter,
  cutout_photo: Cutout,
  consumer_unit_photo: ConsumerUnit,
  charger_location_photo: ChargerSpot,
  parking_evidence: Paper,
  order_agreement: Paper,
  landlord_permission: Paper,
  other: Anything,
};

/**
 * What a good photo for this slot looks like, 160 × 120, inside viewfinder corners with a tick.
 * @example <GoodPhotoPicture kind="cutout_photo" />
 */
export function GoodPhotoPicture({ kind, className = 'h-[90px] w-[120px]' }: { kind: UploadKind; className?: string }) {
  const Drawing = drawings[kind];
  return (
    <svg viewBox="0 0 160 120" className={`shrink-0 rounded-md bg-white ${className}`} aria-hidden="true" focusable="false" data-testid="good-photo-picture">
      <Drawing />
      {/* viewfinder corners: fill the frame */}
      <path d="M6 20V6h14M140 6h14v14M154 100v14h-14M20 114H6v-14" stroke="#5a6f6b" strokeWidth="3" fill="none" strokeLinecap="round" />
      <circle cx="146" cy="106" r="10" fill="#1f7a4d" />
      <path d="m141 106 3.5 3.5 6.5-7" stroke="#fff" strokeWidth="2.5" fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
