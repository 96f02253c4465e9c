import { useEffect, useRef, useState } from 'react';
import type { FollowUpItem, SelfReportLink } from '../../../shared/schemas/follow-ups';
import { ErrorNotice } from '../../components/error-notice';
import { formatDate } from '../episodes/format';
import { useCreateSelfReportLink } from './api/create-self-report-link';
import { FOLLOW_UP_LABELS } from './labels';
import { printLinkSheet, qrCodeDataUrl } from './qr-code';

const expiryText = (iso: string) => formatDate(iso.slice(0, 10));

/**
 * Makes a single-use link for one episode and follow-up and shows it as text and QR code, to hand over in person:
 * the registry never stores or sends to a patient's e-mail address or phone number.
 */
export function SelfReportLinkDialog({ item, onClose }: { item: FollowUpItem; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const create = useCreateSelfReportLink();
  const [link, setLink] = useState<SelfReportLink | null>(null);
  const [qr, setQr] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);
  const [popupBlocked, setPopupBlocked] = useState(false);

  useEffect(() => {
    const d = ref.current;
    if (!d || d.open) return;
    // Without native <dialog> support the panel still shows, just not as a modal.
    if (typeof d.showModal === 'function') d.showModal();
    else d.setAttribute('open', '');
  }, []);

  useEffect(() => {
    if (!link) return;
    let live = true;
    qrCodeDataUrl(link.url).then(
      (u) => live && setQr(u),
      () => live && setQr(null),
    );
    return () => {
      live = false;
    };
  }, [link]);

  // Closing fires the dialog's close event (→ onClose); without native <dialog> support, call it directly.
  const close = () => (ref.current?.open && typeof ref.current.close === 'function' ? ref.current.close() : onClose());
  const make = () => create.mutate({ episodeId: item.episodeId, timepoint: item.timepoint }, { onSuccess: setLink });
  const copy = async () => {
    if (!link) return;
    await navigator.clipboard?.writeText(link.url).then(
      () => setCopied(true),
      () => setCopied(false),
    );
  };
  const what = `${item.reference}, ${FOLLOW_UP_LABELS[item.timepoint]}`;

  return (
    <dialog
      ref={ref}
      aria-labelledby="self-report-link-title"
      onClose={onClose}
      className="m-auto w-full max-w-lg rounded border border-line bg-surface p-6 text-ink shadow-lg backdrop:bg-ink/40"
    >
      <h2 id="self-report-link-title" className="text-lg font-semibold">
        Patient link for {what}
      </h2>
      {!link ? (
        <div className="mt-3 space-y-3 text-sm">
          <p className="text-ink-soft">
            The patient answers the {FOLLOW_UP_LABELS[item.timepoint].toLowerCase()} questions on their own phone,
            without an account. The link works once and for 14 days. Hand it over in person, printed or on screen:
            Loadline never stores or sends to a patient’s e-mail address or phone number.
          </p>
          {create.error ? <ErrorNotice error={create.error} title="The link could not be made" /> : null}
          <div className="flex gap-2">
            <button
              type="button"
              onClick={make}
              disabled={create.isPending}
              className="rounded bg-accent px-4 py-2 font-medium text-white hover:bg-accent-strong disabled:opacity-60"
            >
              {create.isPending ? 'Making the link…' : 'Make the link'}
            </button>
            <button type="button" onClick={close} className="rounded border border-line px-4 py-2 hover:border-accent">
              Cancel
            </button>
          </div>
        </div>
      ) : (
        <div className="mt-3 space-y-3 text-sm">
          {qr ? (
            <img src={qr} alt={`QR code of the patient link for ${what}`} className="mx-auto h-56 w-56" />
          ) : (
            <p className="text-ink-faint">Drawing the QR code…</p>
          )}
          <p className="break-all rounded bg-canvas p-2 font-mono text-xs" data-testid="self-report-url">
            <a href={link.url} target="_blank" rel="noreferrer" className="text-accent underline">
              {link.url}
            </a>
          </p>
          <p className="text-ink-soft">
            Works once, until {expiryText(link.expiresAt)}. Anyone with the link can answer, so give it only to the
            patient.
          </p>
          <p aria-live="polite" className="text-xs text-good">
            {copied ? 'Copied.' : ''}
            {popupBlocked ? 'The browser blocked the print window; allow pop-ups for Loadline.' : ''}
          </p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              onClick={() => void copy()}
              className="rounded border border-line px-4 py-2 hover:border-accent"
            >
              Copy link
            </button>
            <button
              type="button"
              disabled={!qr}
              onClick={() =>
                setPopupBlocked(
                  !printLinkSheet({
                    qr: qr!,
                    url: link.url,
                    expires: expiryText(link.expiresAt),
                    clinicWords: 'Your clinic would like to know how your heel is doing.',
                  }),
                )
              }
              className="rounded border border-line px-4 py-2 hover:border-accent disabled:opacity-60"
            >
              Print for the patient
            </button>
            <button
              type="button"
              onClick={close}
              className="rounded bg-accent px-4 py-2 font-medium text-white hover:bg-accent-strong"
            >
              Done
            </button>
          </div>
        </div>
      )}
    </dialog>
  );
}
