import { beadCommands } from './bead-commands';
import { ionCommands } from './ion-commands';
import { proposalCommands } from './proposal-commands';
import { historyCommands, selectionCommands, viewCommands } from './other-commands';
import type { EditorCommand } from './registry';

/** Every editor command, in the order the help overlay lists them. */
export const editorCommands: readonly EditorCommand[] = [...beadCommands, ...ionCommands, ...proposalCommands, ...selectionCommands, ...historyCommands, ...viewCommands];

export const commandNamed = (name: string): EditorCommand => {
  const found = editorCommands.find((c) => c.name === name);
  if (!found) throw new Error(`No editor command ${name}.`);
  return found;
};
