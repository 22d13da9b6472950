// The Bin: deleted drafts kept for 30 days, and the ways in and out.
export { useBinDraft, useRestoreDraft, useBin } from './api/bin';
export { BinPage } from './components/bin-page';
