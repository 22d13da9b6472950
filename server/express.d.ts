// What passport puts on req.user: the account without its hash (loaded per request from the session's id).
declare global {
  namespace Express {
    interface User {
      id: number;
      email: string;
      name: string;
      isAdmin: boolean;
    }
  }
}

export {};
