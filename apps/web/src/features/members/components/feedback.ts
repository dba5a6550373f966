/** The outcome of an action on the members page, shown above the tables. */
export interface Feedback {
  tone: 'ok' | 'error';
  text: string;
}

export type OnFeedback = (feedback: Feedback) => void;

export function errorFeedback(error: unknown): Feedback {
  return {
    tone: 'error',
    text: error instanceof Error ? error.message : 'Something went wrong. Please try again.',
  };
}
