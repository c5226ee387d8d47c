export function escapeHtml(s: string): string {
  return s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );
}

/** The frame every Sixfold e-mail shares: plain, readable, no images to fetch. */
export function layout(body: string): string {
  return `<!doctype html>
<html lang="en"><body style="margin:0;padding:24px;background:#f8f6f1;font-family:Manrope,Helvetica,Arial,sans-serif;color:#141b2b;line-height:1.6">
<div style="max-width:520px;margin:0 auto;background:#ffffff;border:1px solid #d6d1c5;border-radius:14px;padding:24px">
<p style="margin:0 0 16px;font-weight:800;font-size:18px;color:#b67b0c">Sixfold</p>
${body}
</div>
<p style="max-width:520px;margin:16px auto 0;font-size:12px;color:#545c6e">You get this because an account on this Sixfold uses your address.</p>
</body></html>`;
}
