// Small inline SVG icons. Each is decorative (aria-hidden) and always sits next to words, so
// colour and shape are never the only signal. Emoji are avoided: they do not render everywhere.
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

/** A tick in a circle: done, saved, complete. @example <CheckIcon /> Saved */
export function CheckIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="m7.5 12.5 3 3 6-6.5" />
    </Svg>
  );
}

/** A triangle with an exclamation mark: needs attention, a warning. @example <WarningIcon /> Check this */
export function WarningIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M10.3 3.9 2.4 18a2 2 0 0 0 1.7 3h15.8a2 2 0 0 0 1.7-3L13.7 3.9a2 2 0 0 0-3.4 0Z" />
      <path d="M12 9v4.5" />
      <path d="M12 17.2h.01" />
    </Svg>
  );
}

/** An octagon with a bar: an error, or a safety "don't". @example <StopIcon /> Never open the cut-out */
export function StopIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M8.2 2.5h7.6l5.7 5.7v7.6l-5.7 5.7H8.2l-5.7-5.7V8.2Z" />
      <path d="M8 12h8" />
    </Svg>
  );
}

/** A lower-case i in a circle: help or a note. @example <InfoIcon /> What is an MPAN? */
export function InfoIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="M12 11v5.5" />
      <path d="M12 7.6h.01" />
    </Svg>
  );
}

/** A turning arc: work in progress (spins unless the visitor prefers reduced motion). */
export function SpinnerIcon({ className = 'h-5 w-5' }: IconProps) {
  return (
    <Svg className={`motion-safe:animate-spin ${className}`}>
      <path d="M12 3a9 9 0 1 0 9 9" />
    </Svg>
  );
}

/** An empty circle: not started. */
export function CircleIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9.5" />
    </Svg>
  );
}

/** A pencil: edit. */
export function PencilIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M16.5 3.5a2.1 2.1 0 0 1 3 3L8 18l-4 1 1-4Z" />
    </Svg>
  );
}

/** A paper plane: send. */
export function SendIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M21.5 2.5 10.5 13.5" />
      <path d="M21.5 2.5 14.5 21.5l-4-8-8-4Z" />
    </Svg>
  );
}

export function ChevronLeftIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="m15 18-6-6 6-6" />
    </Svg>
  );
}

export function ChevronRightIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="m9 18 6-6-6-6" />
    </Svg>
  );
}

export function ChevronDownIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="m6 9 6 6 6-6" />
    </Svg>
  );
}

export function ChevronUpIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="m18 15-6-6-6 6" />
    </Svg>
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

/** A plus sign: more, add. @example <PlusIcon /> */
export function PlusIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M12 5v14M5 12h14" />
    </Svg>
  );
}

/** A minus sign: less. @example <MinusIcon /> */
export function MinusIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M5 12h14" />
    </Svg>
  );
}

/** Four arrows: this item can be moved. @example <MoveIcon /> Drag or use the arrow keys */
export function MoveIcon(props: IconProps) {
  return (
    <Svg {...props}>
      <path d="M12 3v18M3 12h18" />
      <path d="m9 5.5 3-3 3 3M9 18.5l3 3 3-3M5.5 9l-3 3 3 3M18.5 9l3 3-3 3" />
    </Svg>
  );
}
