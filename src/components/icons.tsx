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
