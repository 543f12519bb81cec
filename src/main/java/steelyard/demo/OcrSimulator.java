package steelyard.demo;

/**
 * Simulated OCR configurations reading one printed docket line. Each {@link Profile} has its own rates for the
 * character errors typical of OCR: letter shapes ({@code rn→m}, {@code cl→d}, {@code e→c}), digit/letter
 * look-alikes ({@code l↔1}, {@code O↔0}, {@code S↔5}, {@code B↔8}), dropped or misread punctuation, broken
 * spacing (a word split or two words run together), case flips and lost characters; and its own confidence
 * calibration. A line's damage is partly shared (a smudge every configuration misreads the same way, a poor scan)
 * and partly each configuration's own, so that combining configurations helps but cannot fix everything.
 */
final class OcrSimulator {
  /**
   * Error profile of one configuration: per-opportunity rates of shape, digit/letter, punctuation-drop,
   * punctuation-swap, split, merge, case and drop errors; and its confidence bias (0–100 points).
   */
  record Profile(String name, double shape, double lookalike, double punctDrop, double punctSwap, double split,
      double merge, double caseFlip, double drop, double confidenceBias) {}

  /** The invented configurations of the demo (names are this project's own). */
  static final Profile[] PROFILES = {
    new Profile("line-gray", 0.035, 0.050, 0.050, 0.020, 0.010, 0.030, 0.008, 0.008, 0.0),
    new Profile("line-mono", 0.090, 0.040, 0.140, 0.030, 0.015, 0.040, 0.006, 0.016, 2.5),
    new Profile("block-deskew", 0.025, 0.030, 0.030, 0.015, 0.050, 0.100, 0.010, 0.006, -1.5),
    new Profile("block-upscale", 0.020, 0.020, 0.050, 0.050, 0.015, 0.030, 0.050, 0.008, 5.0),
    new Profile("word-sharpen", 0.040, 0.140, 0.020, 0.012, 0.008, 0.020, 0.008, 0.010, -3.0),
  };

  /** A configuration's reading of a line: its text, edit operations applied, and 0–100 mean word confidence. */
  record Reading(String system, String text, int edits, double meanWordConf) {}

  private final Dice dice;

  OcrSimulator(Dice dice) {
    this.dice = dice;
  }

  /** A shared smudge: with some chance, one or two characters every configuration misreads the same way. */
  String smudge(String line, double damage) {
    StringBuilder out = new StringBuilder(line);
    int marks = dice.chance(Math.min(0.8, 0.08 * damage)) ? dice.between(1, 2) : 0;
    for (int m = 0; m < marks && out.length() > 1; m++) {
      int at = dice.below(out.length());
      char c = out.charAt(at);
      String look = lookalike(c);
      if (look != null) out.replace(at, at + 1, look);
      else if (isPunct(c) || c != ' ' && dice.chance(0.3)) out.deleteCharAt(at);
      else if (Character.isLetter(c)) out.setCharAt(at, Character.isUpperCase(c) ? Character.toLowerCase(c) : 'c');
    }
    return out.toString();
  }

  /** One configuration's reading of the (possibly smudged) line; {@code truthEdits} counts shared damage. */
  Reading read(Profile p, String line, double damage, int truthEdits) {
    double f = damage * StrictMath.exp(dice.normal(0, 0.35));
    StringBuilder out = new StringBuilder(line.length() + 8);
    int edits = truthEdits;
    int i = 0;
    while (i < line.length()) {
      char c = line.charAt(i);
      String two = i + 1 < line.length() ? line.substring(i, i + 2) : "";
      if (two.equals("rn") && dice.chance(p.shape() * f * 4)) { out.append('m'); i += 2; edits++; continue; }
      if (two.equals("cl") && dice.chance(p.shape() * f * 4)) { out.append('d'); i += 2; edits++; continue; }
      if (two.equals("vv") && dice.chance(p.shape() * f * 4)) { out.append('w'); i += 2; edits++; continue; }
      i++;
      if (c == ' ') {
        if (dice.chance(p.merge() * f)) edits++;
        else out.append(dice.chance(p.split() * f * 0.3) ? "  " : " ");
        continue;
      }
      if (isPunct(c)) {
        if (dice.chance(p.punctDrop() * f)) { edits++; continue; }
        if (dice.chance(p.punctSwap() * f)) { out.append(punctSwap(c)); edits++; continue; }
        out.append(c);
        continue;
      }
      if (dice.chance(p.drop() * f)) { edits++; continue; }
      String shape = shape(c);
      if (shape != null && dice.chance(p.shape() * f)) { out.append(shape); edits++; continue; }
      String look = lookalike(c);
      if (look != null && dice.chance(p.lookalike() * f)) { out.append(look); edits++; continue; }
      if (Character.isLetter(c) && dice.chance(p.caseFlip() * f)) {
        out.append(Character.isUpperCase(c) ? Character.toLowerCase(c) : Character.toUpperCase(c));
        edits++;
        continue;
      }
      out.append(c);
      if (Character.isLetterOrDigit(c) && i < line.length() && line.charAt(i) != ' ' && dice.chance(p.split() * f)) {
        out.append(' ');
        edits++;
      }
    }
    String text = out.toString().strip();
    return new Reading(p.name(), text, edits, confidence(p, line, edits, damage));
  }

  /** Mean word confidence 0–100: falls with the share of damaged words and with scan damage; noisy; biased. */
  private double confidence(Profile p, String line, int edits, double damage) {
    int words = Math.max(1, line.split(" ").length);
    double value = 93.0 + p.confidenceBias() - 15.0 * edits / words - 5.0 * (damage - 1.0) + dice.normal(0, 6.5);
    // Engines rarely report a flat 100: squash smoothly towards 99.9 instead of clipping (no artificial ties).
    if (value > 97.0) value = 97.0 + 2.9 * (1.0 - StrictMath.exp(-(value - 97.0) / 2.9));
    return Math.max(3.0, value);
  }

  private static boolean isPunct(char c) {
    return ":/-().,#@".indexOf(c) >= 0;
  }

  private String punctSwap(char c) {
    switch (c) {
      case ':': return dice.chance(0.5) ? ";" : ".";
      case '/': return dice.chance(0.5) ? "l" : "1";
      case '(': return dice.chance(0.5) ? "C" : "{";
      case ')': return dice.chance(0.5) ? "]" : "}";
      case '-': return dice.chance(0.5) ? "~" : ".";
      case '.': return ",";
      case ',': return ".";
      case '#': return "H";
      default: return String.valueOf(c);
    }
  }

  private static String shape(char c) {
    switch (c) {
      case 'm': return "rn";
      case 'd': return "cl";
      case 'w': return "vv";
      case 'e': return "c";
      case 'c': return "e";
      case 'h': return "b";
      case 'a': return "o";
      case 'n': return "ri";
      case 'u': return "ii";
      default: return null;
    }
  }

  private static String lookalike(char c) {
    switch (c) {
      case 'l': return "1";
      case '1': return "l";
      case 'I': return "1";
      case 'O': return "0";
      case '0': return "O";
      case 'o': return "0";
      case 'S': return "5";
      case '5': return "S";
      case 'B': return "8";
      case '8': return "B";
      case 'Z': return "2";
      case '2': return "Z";
      case 'G': return "6";
      case '6': return "b";
      case 'g': return "9";
      case '9': return "g";
      default: return null;
    }
  }
}
