package steelyard.gui;

import javax.accessibility.AccessibleContext;
import javax.accessibility.AccessibleRole;
import javax.swing.JComponent;

/**
 * A component the window paints itself (an alignment, a network): gives it an accessible context, so that
 * screen readers get the text form its owner sets with {@code setAccessibleDescription}.
 */
abstract class DrawnComponent extends JComponent {
  private static final long serialVersionUID = 1L;
  private final AccessibleRole role;

  DrawnComponent(AccessibleRole role) {
    this.role = role;
  }

  @Override
  public AccessibleContext getAccessibleContext() {
    if (accessibleContext == null) {
      accessibleContext = new AccessibleJComponent() {
        private static final long serialVersionUID = 1L;
        @Override public AccessibleRole getAccessibleRole() {
          return role;
        }
      };
    }
    return accessibleContext;
  }
}
