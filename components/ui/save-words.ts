// The one phrase both save badges use once everything is stored on the server.
export const SAVED_WORDS = 'Kept safe';
