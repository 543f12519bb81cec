package steelyard.gui;

import com.formdev.flatlaf.FlatLaf;
import com.formdev.flatlaf.FlatLightLaf;
import java.awt.Color;
import java.awt.Font;
import java.util.Map;
import javax.swing.UIManager;
import steelyard.gui.model.AlignedPair;
import steelyard.gui.model.Choices;
import steelyard.report.charts.Palette;

/**
 * The window's look: FlatLaf's light theme with the project's ink-and-blue accent, and the colours that
 * carry meaning (verdicts, edits). Every colour that means something is paired with a text mark elsewhere,
 * never used alone; the meanings follow the chart palette ({@link Palette}): blue for the choice and for
 * help, amber for rank 1 and for harm.
 */
public final class Theme {
  /** Header band behind the corpus figures. */
  public static final Color BAND = new Color(0x22, 0x28, 0x31);
  /** Text on the band. */
  public static final Color BAND_TEXT = new Color(0xF2, 0xF4, 0xF7);
  /** Muted text on the band. */
  public static final Color BAND_MUTED = new Color(0xA9, 0xB3, 0xC1);
  /** Background of the chosen path and the chosen row. */
  public static final Color CHOSEN_FILL = new Color(0xDC, 0xE9, 0xF7);
  /** Posterior bars. */
  public static final Color BAR = new Color(0x7C, 0xA7, 0xD6);
  /** Substitution cells. */
  public static final Color SUBSTITUTION = new Color(0xFB, 0xE3, 0xB8);
  /** Deletion cells. */
  public static final Color DELETION = new Color(0xF6, 0xC9, 0xC0);
  /** Insertion cells. */
  public static final Color INSERTION = new Color(0xD6, 0xE4, 0xF5);
  /** Ignored (optional) tokens. */
  public static final Color IGNORED = new Color(0xEC, 0xEE, 0xF1);
  /** Muted text. */
  public static final Color MUTED = new Color(0x6B, 0x72, 0x7C);

  private Theme() {}

  /** Installs the look and feel once, before any component is made (call on the EDT). */
  public static void install() {
    if (UIManager.getLookAndFeel() instanceof FlatLaf) return;
    FlatLaf.setGlobalExtraDefaults(Map.of("@accentColor", Palette.hex(Palette.BLUE)));
    FlatLightLaf.setup();
    UIManager.put("Table.showHorizontalLines", true);
    UIManager.put("Table.intercellSpacing", new java.awt.Dimension(0, 1));
    UIManager.put("ScrollBar.showButtons", false);
    UIManager.put("Component.focusWidth", 1);
    UIManager.put("TabbedPane.showTabSeparators", true);
  }

  /** Text colour of a verdict. */
  public static Color verdict(Choices.Verdict v) {
    switch (v) {
      case HELPED: return Palette.BLUE;
      case HURT: return Palette.BRICK;
      case NEUTRAL: case UNVERIFIED: return MUTED;
      default: return Palette.INK;
    }
  }

  /** Symbol and word of a verdict, so it never shows by colour alone. */
  public static String verdictText(Choices.Verdict v) {
    switch (v) {
      case HELPED: return "▲ helped";
      case HURT: return "▼ hurt";
      case NEUTRAL: return "◆ changed, same errors";
      case UNVERIFIED: return "◇ changed, no reference";
      default: return "· as rank 1";
    }
  }

  /** Cell colour of an edit. */
  public static Color edit(AlignedPair.Kind k) {
    switch (k) {
      case SUBSTITUTION: return SUBSTITUTION;
      case DELETION: return DELETION;
      case INSERTION: return INSERTION;
      case IGNORED: return IGNORED;
      default: return null;
    }
  }

  /** {@code f} at {@code size} points and {@code style}. */
  public static Font font(Font f, int style, float size) {
    return f.deriveFont(style, size);
  }
}
