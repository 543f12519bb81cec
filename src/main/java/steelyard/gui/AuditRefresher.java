package steelyard.gui;

import steelyard.gui.model.Choices;
import steelyard.gui.model.Workspace;
import steelyard.text.Unit;

/**
 * Keeps the overrule audit in step with the current choices while its view is showing: the audit of a
 * choice is computed once in the background and kept until the choice changes. EDT only.
 */
final class AuditRefresher {
  private final SteelyardWindow window;
  private Choices audited;

  AuditRefresher(SteelyardWindow window) {
    this.window = window;
  }

  void invalidate() {
    audited = null;
    window.audit.clear("The audit is computed when this view is shown.");
  }

  void refreshIfVisible() {
    Workspace ws = window.workspace();
    Choices c = window.choices();
    if (ws == null || c == null || window.views.getSelectedComponent() != window.audit || c == audited) return;
    window.audit.clear("Auditing the overrules …");
    window.tasks.submit("audit", "Auditing the overrules", p -> ws.audit(c.weights(), c.method(), p), (o, report, e) -> {
      if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(window, "Cannot audit", e);
      if (o != Tasks.Outcome.COMPLETE || ws != window.workspace() || c != window.choices()) return;
      audited = c;
      window.audit.show(report, ws.corpus().unit() == Unit.CHAR ? "character" : "word");
    });
  }
}
