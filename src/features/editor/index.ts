// The draft editor, for the /drafts/:id page and the playground.
export { DraftEditor, type DraftEditorProps } from './components/draft-editor';
export type { SaveFn, SaveResult } from './store/autosave';
export type { Arrangement } from './canvas/layout';
