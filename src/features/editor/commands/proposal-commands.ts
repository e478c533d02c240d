import { plainKey, type EditorCommand } from './registry';

// "Propose" asks the server for a proposal; the proposal panel shows it as ghosts to accept or dismiss.
export const proposalCommands: EditorCommand[] = [
  {
    name: 'propose',
    label: 'Propose',
    group: 'beads',
    shortcut: 'P',
    keyTest: plainKey('p'),
    edits: true,
    perform: (ctx) => ctx.ui.propose(),
  },
];
