// The editor playground on its own page, for tests/bench/editor.bench.ts (no router, no server).
import { createRoot } from 'react-dom/client';
import '../../../src/index.css';
import EditorPlayground from '../../../src/features/editor/editor-playground';

createRoot(document.getElementById('root')!).render(<EditorPlayground />);
