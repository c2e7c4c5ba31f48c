// Plain words for what browsers throw when storage fails.

function errorName(e: unknown): string {
  if (e && typeof e === 'object' && 'name' in e) return String((e as { name: unknown }).name);
  return '';
}

export function describeStorageError(e: unknown): string {
  const name = errorName(e);
  const detail = e instanceof Error || e instanceof DOMException ? e.message : String(e);
  if (name === 'QuotaExceededError' || /quota/i.test(detail)) {
    return 'Browser storage for this page is full, so the latest changes are NOT saved here. Save the workbook to a file now (Workbook → Save file), then free space in the browser.';
  }
  if (name === 'InvalidStateError' || name === 'SecurityError' || name === 'UnknownError') {
    return `Browser storage is not available (${name}${detail ? `: ${detail}` : ''}), so changes are NOT saved here. Save the workbook to a file to keep it.`;
  }
  return `Saving to browser storage failed (${name || 'error'}${detail ? `: ${detail}` : ''}). Save the workbook to a file to keep your changes.`;
}
