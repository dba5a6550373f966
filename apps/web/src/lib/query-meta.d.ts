import '@tanstack/react-query';

declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: {
      /** The answer is the same whoever is signed in (e.g. health): keep it across sessions. */
      keepAcrossSessions?: boolean;
    };
  }
}
