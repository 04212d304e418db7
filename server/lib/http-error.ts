export interface IssueOut {
  path: string;
  message: string;
}

/** Thrown by services; the error handler turns it into `{ error, issues? }` with this status. */
export class HttpError extends Error {
  constructor(
    public status: number,
    message: string,
    public issues?: IssueOut[],
    public headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'That') => new HttpError(404, `${what} could not be found.`);
