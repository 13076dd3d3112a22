/**
 * The client's number, money and date formatting. The implementation lives in shared/format.ts
 * because the server's printable report and e-mails write numbers the same way.
 */
export {
  formatAmount,
  formatCompact,
  formatCount,
  formatDate,
  formatDateTime,
  formatDuration,
  formatInterval,
  formatNumber,
  formatPercent,
  formatPValue,
  formatSignificant,
  formatTime,
  getCurrencyCode,
  MINUS,
  MISSING,
} from '@shared/format';
