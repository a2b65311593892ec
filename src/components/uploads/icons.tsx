// Inline SVG icons for the upload slots. Decorative (aria-hidden): each sits beside its word,
// so the review status never rests on colour or shape alone. No emoji: they do not render everywhere.
import type { ReactNode } from 'react';

type IconProps = { className?: string };

function Svg({ className = 'h-5 w-5', children }: IconProps & { children: ReactNode }) {
  return (
    <svg
      viewBox="0 0 24 24"
      className={`shrink-0 ${className}`}
      fill="none"
      stroke="currentColor"
      strokeWidth={2}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
    >
      {children}
    </svg>
  );
}

/** A clock: waiting for the office to look. @example <ClockIcon /> Waiting for review */
export function ClockIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="M12 7v5l3 2" />
    </Svg>
  );
}

/** A tick in a circle: accepted. @example <AcceptedIcon /> Accepted */
export function AcceptedIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="m7.5 12.5 3 3 6-6.5" />
    </Svg>
  );
}

/** A cross in a circle: not accepted. @example <NotAcceptedIcon /> Not accepted */
export function NotAcceptedIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="m9 9 6 6M15 9l-6 6" />
    </Svg>
  );
}

/** An empty dashed circle: nothing sent yet. @example <MissingIcon /> Still needed */
export function MissingIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" strokeDasharray="3 3" />
    </Svg>
  );
}

/** A camera: photos. @example <CameraIcon /> */
export function CameraIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M4 8h3l1.6-2.4A1.5 1.5 0 0 1 9.9 5h4.2a1.5 1.5 0 0 1 1.3.6L17 8h3a1 1 0 0 1 1 1v9a1 1 0 0 1-1 1H4a1 1 0 0 1-1-1V9a1 1 0 0 1 1-1Z" />
      <circle cx="12" cy="13" r="3.5" />
    </Svg>
  );
}

/** A page with a folded corner: a document (PDF). @example <DocumentIcon /> */
export function DocumentIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M14 3H7a1 1 0 0 0-1 1v16a1 1 0 0 0 1 1h10a1 1 0 0 0 1-1V7Z" />
      <path d="M14 3v4h4M9 12h6M9 16h6" />
    </Svg>
  );
}

/** A bin: remove. @example <BinIcon /> Remove */
export function BinIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M4 7h16M10 11v6M14 11v6M6 7l1 13h10l1-13M9 7V4h6v3" />
    </Svg>
  );
}

/** An octagon with a bar: a safety "don't" or an error. @example <StopIcon /> Never remove covers */
export function StopIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M8.2 2.5h7.6l5.7 5.7v7.6l-5.7 5.7H8.2l-5.7-5.7V8.2Z" />
      <path d="M8 12h8" />
    </Svg>
  );
}

/** A lower-case i in a circle: what a good photo shows. @example <InfoIcon /> */
export function InfoIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="M12 11v5.5M12 7.5h.01" />
    </Svg>
  );
}
