/**
 * A spectrum opened from the explorer while a structure note is the active editor goes beside the
 * note instead of covering it. VS Code opens a default custom editor in the active group and offers
 * no option for that, so we watch the tabs: when our editor opens as the active tab of the group
 * whose active tab was just a markdown note (still open there), it is moved one group to the right
 * with the documented `moveActiveEditor` command ({ to: 'right', by: 'group' }, which creates the
 * group when there is none). Dragging a panel into the note's group is not undone: then the tab
 * active before was the panel itself, not the note. `Couplet: Open Spectrum` (palette and explorer
 * context menu) opens beside the note directly.
 */
import * as vscode from 'vscode';
import { shouldMoveBeside, type TabFacts } from './tabPlacement';

function facts(tab: vscode.Tab | undefined, viewType: string): TabFacts | null {
  if (!tab) return null;
  const column = tab.group.viewColumn;
  const input = tab.input;
  if (input instanceof vscode.TabInputCustom && input.viewType === viewType) return { kind: 'spectrum', uri: input.uri.toString(), column };
  if (input instanceof vscode.TabInputText && /\.(md|markdown)$/i.test(input.uri.path)) return { kind: 'note', uri: input.uri.toString(), column };
  return { kind: 'other', uri: '', column };
}

export function keepNotesInView(viewType: string): vscode.Disposable {
  const activeTab = (): vscode.Tab | undefined => vscode.window.tabGroups.activeTabGroup.activeTab;
  const key = (f: TabFacts): string => `${f.column ?? ''}|${f.uri}`;
  let previous = facts(activeTab(), viewType);
  // Opened spectrum tabs not yet seen active: VS Code may report the opening and the activation
  // in separate events, so the decision waits for the activation.
  const fresh = new Set<string>();
  const onTabs = (e: vscode.TabChangeEvent): void => {
    for (const t of e.opened) {
      const f = facts(t, viewType);
      if (f?.kind === 'spectrum') fresh.add(key(f));
    }
    const before = previous;
    const now = activeTab();
    const f = facts(now, viewType);
    previous = f;
    if (!now || !f || f.kind !== 'spectrum' || !fresh.delete(key(f)) || !before) return;
    const noteOpen = now.group.tabs.some((t) => t.input instanceof vscode.TabInputText && t.input.uri.toString() === before.uri);
    if (shouldMoveBeside(before, f, noteOpen)) void vscode.commands.executeCommand('moveActiveEditor', { to: 'right', by: 'group' });
  };
  return vscode.Disposable.from(
    vscode.window.tabGroups.onDidChangeTabs(onTabs),
    vscode.window.tabGroups.onDidChangeTabGroups(() => {
      previous = facts(activeTab(), viewType);
    }),
  );
}
