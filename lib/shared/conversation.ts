// What the pages show of a sheet's conversation, shared by the server's queries and the browser.

/** A farmer's question no answer names yet, with where it was asked. */
export interface OpenQuestion {
  id: string;
  visitId: string;
  farmName: string;
  farmerName: string;
  text: string;
  at: string;
}
