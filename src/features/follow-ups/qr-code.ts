/** An SVG QR code of `text` as a data: URL (qrcode is loaded only when a link is shown). */
export async function qrCodeDataUrl(text: string): Promise<string> {
  const QR = await import('qrcode');
  const svg = await QR.toString(text, {
    type: 'svg',
    errorCorrectionLevel: 'M',
    margin: 2,
    color: { dark: '#1d2a2fff', light: '#ffffffff' },
  });
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/**
 * A plain printable sheet in a new tab (the page itself would print the whole app): the QR code, the link,
 * its expiry and the caution. The opener fills it, so the sheet runs no script of its own.
 */
export function printLinkSheet(opts: { qr: string; url: string; expires: string; clinicWords: string }): boolean {
  const w = window.open('', '_blank');
  if (!w) return false;
  w.document.title = 'Your follow-up questions';
  w.document.body.innerHTML = `<div style="font-family:sans-serif;max-width:420px;margin:32px auto;color:#1d2a2f">
<h1 style="font-size:20px">Your follow-up questions</h1>
<p>${escape(opts.clinicWords)} Scan the code with your phone's camera, or type the address below. It takes about two minutes.</p>
<img src="${escape(opts.qr)}" alt="QR code of the link" style="width:260px;height:260px;display:block;margin:16px 0" />
<p style="word-break:break-all;font-size:13px">${escape(opts.url)}</p>
<p style="font-size:13px">The link works once and until ${escape(opts.expires)}.</p>
<p style="font-size:12px;color:#4a5a60">This does not replace your clinician. If your heel becomes hot, red and swollen with a fever, if you get numbness or tingling, pain at night or at rest that keeps getting worse, or a sudden pop or bruising, contact your clinic promptly or, if it is urgent, your local emergency services.</p>
</div>`;
  w.focus();
  w.print();
  return true;
}
