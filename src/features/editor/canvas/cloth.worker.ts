// The cloth views' and Checks' work off the page's main thread, so drawing stays smooth while a
// large draft's views are worked out. Messages: a ClothRequest in, its ClothResult out.
import { createClothWorker, transferablesOf, withBitmaps, type ClothRequest, type ClothResult } from './cloth-work';

interface WorkerScope {
  onmessage: ((event: MessageEvent<ClothRequest>) => void) | null;
  postMessage(message: ClothResult, transfer: Transferable[]): void;
}

const scope = self as unknown as WorkerScope;
const work = createClothWorker();

scope.onmessage = (event) => {
  const result = withBitmaps(work(event.data));
  scope.postMessage(result, transferablesOf(result));
};
