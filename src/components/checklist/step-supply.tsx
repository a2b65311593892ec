// Your meter and fuse: the MPAN, the main fuse and a looped supply; photos of the
// meter and cut-out. The consumer unit, earthing and phases come next, then the photos (step-loads.tsx).
import { checkMpanCore, INDEPENDENT_NETWORK, normaliseMpanCore, UNLISTED_DISTRIBUTOR } from '@/lib/validation/mpan';
import { CheckIcon } from '@/components/icons';
import { useChecklist } from './checklist-context';
import { ChoiceField, NumberField, TextField, useFieldValue } from './fields';
import { caution } from '@/lib/cautions';
import { Caution, MoreHelp } from './notes';

/** The region line shown once an MPAN core passes its check digit. */
export function regionLine(region: string): string {
  if (region === INDEPENDENT_NETWORK) return 'Distribution network: an independent network operator';
  if (region === UNLISTED_DISTRIBUTOR) return 'The number adds up; we’ll check which network it belongs to';
  return `Distribution region: ${region}`;
}

function MpanField() {
  const { form } = useChecklist();
  const mpan = useFieldValue('supply.mpanCore');
  const result = mpan.trim() === '' ? null : checkMpanCore(mpan);
  return (
    <TextField
      path="supply.mpanCore"
      inputMode="numeric"
      size="short"
      placeholder="13 digits"
      spellCheck={false}
      // Check as soon as the 13th digit is in, not only on leaving the field.
      onType={(value) => {
        if (normaliseMpanCore(value).length >= 13) void form.trigger('supply.mpanCore');
      }}
      help="The number that identifies your home’s electricity supply. It is printed on your electricity bill. Spaces are fine."
      confirmation={
        result?.ok ? (
          <p className="flex items-center gap-2 font-semibold text-clear">
            <CheckIcon className="h-5 w-5" />
            <span>{regionLine(result.region)}</span>
          </p>
        ) : null
      }
    >
      <MoreHelp summary="Where do I find my MPAN?">
        <p>
          On your electricity bill, usually on the page with your meter details, look for a box of numbers beside a large letter{' '}
          <strong>S</strong>. It may be labelled <strong>Supply number</strong> or MPAN.
        </p>
        <p>
          The box has two lines. Copy the <strong>bottom line</strong>: 13 digits, often printed in groups such as 13 1234 5678 907. The
          top line is not needed.
        </p>
        <p>No bill to hand? Your electricity supplier’s app or online account usually shows it too.</p>
      </MoreHelp>
    </TextField>
  );
}

export function SupplyStep() {
  return (
    <div className="space-y-6">
      <Caution>
        <p>{caution.photosOnly} Everything here can be read from where you stand.</p>
        <p>{caution.meterCupboard}</p>
        <p>{caution.danger}</p>
        <p>{caution.mainFuseCustomer}</p>
      </Caution>

      <MpanField />

      <ChoiceField
        path="supply.mainFuseAmps"
        columns={3}
        help="The main fuse sits inside the cut-out. Its rating, in amps (A), is printed on the front of the fuse holder."
      >
        <MoreHelp summary="What is the cut-out, and how do I read it safely?">
          <p>
            The cut-out is the sealed box where the supply cable comes into your home, usually next to the meter. It is often black or
            grey, with a small wire seal across it.
          </p>
          <p>
            On its front, or on the part in the middle that holds the fuse, look for a number such as <strong>60</strong>,{' '}
            <strong>80</strong> or <strong>100</strong>, sometimes followed by A. Read it without touching anything; a torch helps. If
            there is no number you can see, choose “I can’t read it”.
          </p>
        </MoreHelp>
      </ChoiceField>

      <ChoiceField
        path="supply.looped"
        help="Some older homes, often terraces, share one supply cable with next door. Your installer needs to know, as the network operator may have to separate them first."
      >
        <MoreHelp summary="How can I tell if it’s looped?">
          <p>
            Look, without touching, at the cut-out. If two thick cables leave it, or one runs through the wall towards the house next
            door, the supply may be looped. If you can’t tell, “I’m not sure” is fine.
          </p>
        </MoreHelp>
      </ChoiceField>

    </div>
  );
}
