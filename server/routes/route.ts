import type { z } from 'zod';
import type { Handler, RouteSpec } from '../http/handler';

type Out<S> = S extends z.ZodType ? z.output<S> : undefined;

/** Declares a route; the handler's input types follow from its schemas. */
export function defineRoute<
  B extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(spec: Omit<RouteSpec, 'handle' | 'body' | 'query' | 'params'> & {
  body?: B;
  query?: Q;
  params?: P;
  handle: Handler<Out<B>, Out<Q>, Out<P>>;
}): RouteSpec {
  return spec as RouteSpec;
}
