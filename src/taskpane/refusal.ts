// A refusal the pane explains to the user (a blank box, a step of 0, a changed range), as opposed to a bug.

export class Refusal extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'Refusal';
  }
}
