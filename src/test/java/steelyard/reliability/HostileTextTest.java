package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.opencsv.CSVReader;
import com.opencsv.CSVReaderBuilder;
import com.opencsv.CSVWriter;
import com.opencsv.RFC4180ParserBuilder;
import java.io.IOException;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.text.Normalizer;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.lattice.NetworkExport;

/**
 * Transcripts, ids and group names with markup, quotes, commas, newlines, formula prefixes, right-to-left
 * marks and combining characters survive every export. Data outputs meant for re-import ({@code picks.csv},
 * the breakdown CSV, JSON) keep the raw text exactly (read back with opencsv and Jackson); the report CSV of
 * {@code score} neutralises formula prefixes by default and keeps them with {@code --spreadsheet-safe false};
 * DOT labels of a confusion network are escaped so no token can end a string or add syntax.
 *
 * <p>The formula prefixes ({@code = + - @}, tab, carriage return) are those of the OWASP "CSV Injection"
 * guidance (common practice).
 */
class HostileTextTest {
  static final List<String> TEXTS = List.of(
      "<script>alert(\"dock\")</script> load",
      "say \"ok\", then stop, please",
      "line one\nline two",
      "=SUM(A1:A9) crates",
      "+44 crates",
      "-5 kg pears",
      "@pallet seven",
      "\tindented apples",
      "\rreturned crates",
      "\u200Fpallet \u202Eseven",
      "cafe\u0301 cre\u0300me pallets",
      "=HYPERLINK(\"http://example.invalid\",\"x\")");
  static final List<String> GROUPS = List.of("=cmd|' /C calc'!A0", "<b>dock</b>", "\u202Eeast, bay", "@north");
  static final List<String> MISSING_IDS = List.of("=1+2", "<i>id</i>", "id,with \"quotes\"", "\u200Fid");
  private static final String FORMULA_PREFIXES = "=+-@\t\r";

  @TempDir static Path dir;
  static Path hyps;
  static Path refs;

  @BeforeAll
  static void writeInputs() throws IOException {
    hyps = dir.resolve("hyps.csv");
    refs = dir.resolve("refs.csv");
    List<String[]> h = new ArrayList<>();
    List<String[]> r = new ArrayList<>();
    h.add(new String[] {"utt_id", "system", "rank", "text", "acoustic"});
    r.add(new String[] {"utt_id", "text", "group"});
    for (int i = 0; i < TEXTS.size(); i++) {
      h.add(new String[] {id(i), "asr", "1", TEXTS.get(i), "-1.0"});
      h.add(new String[] {id(i), "asr", "2", TEXTS.get((i + 1) % TEXTS.size()), "-2.0"});
      r.add(new String[] {id(i), "pallet of crates", GROUPS.get(i % GROUPS.size())});
    }
    for (String m : MISSING_IDS) r.add(new String[] {m, "crates", GROUPS.get(0)});
    writeCsv(hyps, h);
    writeCsv(refs, r);
  }

  static String id(int i) {
    return "dock-" + i;
  }

  @Test
  void picksAndBreakdownKeepTheRawTextExactly() throws IOException {
    Path picks = dir.resolve("picks.csv");
    Path breakdown = dir.resolve("breakdown.csv");
    Path json = dir.resolve("rescore.json");
    Cli.Result run = Cli.runBuilt("rescore", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features", "acoustic",
        "--method", "nbest", "--out", picks.toString(), "--breakdown", breakdown.toString(), "--json", json.toString());
    assertThat(run.exit()).as("%s", run).isZero();

    Map<String, Map<String, String>> byUtt = rowsBy(readCsv(picks), "utt_id");
    for (int i = 0; i < TEXTS.size(); i++) {
      assertThat(byUtt.get(id(i))).as("picks row of %s", id(i)).isNotNull();
      assertThat(byUtt.get(id(i)).get("text")).as("picked text of %s", id(i)).isEqualTo(TEXTS.get(i));
    }
    Set<String> breakdownTexts = new TreeSet<>();
    for (Map<String, String> row : readCsv(breakdown)) breakdownTexts.add(row.get("text"));
    assertThat(breakdownTexts).containsExactlyInAnyOrderElementsOf(new TreeSet<>(TEXTS));
    new ObjectMapper().readTree(json.toFile());
  }

  @Test
  void scoreReportCsvNeutralisesFormulaPrefixesAndJsonKeepsRawValues() throws IOException {
    Path csv = dir.resolve("table-safe.csv");
    Path json = dir.resolve("score.json");
    Cli.Result run = Cli.runBuilt("score", "--hyps", hyps.toString(), "--refs", refs.toString(),
        "--csv", csv.toString(), "--json", json.toString(), "--top", "1000");
    assertThat(run.exit()).as("%s", run).isZero();

    Map<String, Map<String, String>> rows = rowsBy(readCsv(csv), "utt_id");
    for (int i = 0; i < TEXTS.size(); i++) {
      assertNeutralised(rows.get(id(i)).get("hyp_text"), TEXTS.get(i));
      assertNeutralised(rows.get(id(i)).get("group"), GROUPS.get(i % GROUPS.size()));
    }
    Set<String> ids = new TreeSet<>();
    for (String rawId : rows.keySet()) ids.add(rawId);
    for (String m : MISSING_IDS) {
      assertThat(ids).as("id %s in the report CSV (neutralised if it starts like a formula)", m)
          .anyMatch(cell -> cell.equals(m) || (startsLikeFormula(m) && !startsLikeFormula(cell) && cell.endsWith(m)));
    }

    JsonNode summary = new ObjectMapper().readTree(json.toFile());
    List<String> missing = new ArrayList<>();
    summary.path("missing_hypothesis_ids").forEach(n -> missing.add(n.asText()));
    assertThat(missing).as("raw ids in the JSON").containsExactlyInAnyOrderElementsOf(MISSING_IDS);
    Set<String> groups = new TreeSet<>();
    summary.path("groups").forEach(g -> groups.add(g.path("group").asText()));
    assertThat(groups).as("raw group names in the JSON").containsAll(GROUPS);
    Set<String> strings = new TreeSet<>();
    collectStrings(summary, strings);
    assertThat(strings).as("a hostile token in the JSON, NFKC-normalised as scoring requires")
        .contains(Normalizer.normalize("<script>alert(\"dock\")</script>", Normalizer.Form.NFKC));
  }

  @Test
  void scoreReportCsvKeepsFormulaPrefixesWhenSpreadsheetSafetyIsOff() throws IOException {
    Path csv = dir.resolve("table-raw.csv");
    Cli.Result run = Cli.runBuilt("score", "--hyps", hyps.toString(), "--refs", refs.toString(),
        "--csv", csv.toString(), "--spreadsheet-safe", "false");
    assertThat(run.exit()).as("%s", run).isZero();
    Map<String, Map<String, String>> rows = rowsBy(readCsv(csv), "utt_id");
    for (int i = 0; i < TEXTS.size(); i++) {
      assertThat(rows.get(id(i)).get("hyp_text")).isEqualTo(TEXTS.get(i));
      assertThat(rows.get(id(i)).get("group")).isEqualTo(GROUPS.get(i % GROUPS.size()));
    }
    assertThat(rows.keySet()).containsAll(MISSING_IDS);
  }

  @Test
  void dotLabelsAreEscapedSoNoTokenAddsSyntax() throws IOException {
    List<String> tokens = List.of("<script>x</script>", "say\"}];b9->b0[label=\"x", "back\\slash\\", "{brace}",
        "line\nbreak", "\u202Eevil", "a\u0301", "&amp;");
    List<List<String>> hypotheses = new ArrayList<>();
    for (String t : tokens) hypotheses.add(List.of("load", t));
    double[] posteriors = new double[tokens.size()];
    java.util.Arrays.fill(posteriors, 1.0 / tokens.size());
    String dot = dotOf(hypotheses, posteriors, "title \"}\n<b>");

    List<String> labels = new ArrayList<>();
    String outside = splitDotStrings(dot, labels);
    assertThat(outside).as("outside strings: no markup or injected statements\n%s", dot).doesNotContain("<").doesNotContain("script");
    assertThat(outside.replace("->", "")).doesNotContain(">");
    assertThat(count(outside, '{')).isEqualTo(1);
    assertThat(count(outside, '}')).isEqualTo(1);
    for (String label : labels) {
      assertThat(label).as("label without raw control or bidi characters").doesNotContain("\n", "\r", "\u202E", "\u200F");
    }
    Set<String> decoded = new TreeSet<>();
    for (String label : labels) decoded.add(decodeDotLabel(label));
    for (String t : tokens) {
      assertThat(decoded).as("token %s recoverable from its escaped label in\n%s", t, dot).anyMatch(d -> d.startsWith(t));
    }
  }

  private static void assertNeutralised(String cell, String raw) {
    if (startsLikeFormula(raw)) {
      assertThat(startsLikeFormula(cell)).as("cell %s no longer starts like a formula", cell).isFalse();
      assertThat(cell).as("content kept").endsWith(raw);
      assertThat(cell.length()).as("one neutralising character added").isEqualTo(raw.length() + 1);
    } else {
      assertThat(cell).isEqualTo(raw);
    }
  }

  private static boolean startsLikeFormula(String s) {
    return !s.isEmpty() && FORMULA_PREFIXES.indexOf(s.charAt(0)) >= 0;
  }

  /** The DOT export of the confusion network of {@code hypotheses}. */
  private static String dotOf(List<List<String>> hypotheses, double[] posteriors, String title) throws IOException {
    ConfusionNetwork net = Lattices.network(hypotheses, posteriors, LatticeSettings.consensusOnly());
    StringWriter out = new StringWriter();
    NetworkExport.writeDot(net, title, out);
    return out.toString();
  }

  /** Removes DOT double-quoted strings (backslash escapes inside) from {@code dot}, collecting their contents. */
  static String splitDotStrings(String dot, List<String> strings) {
    StringBuilder outside = new StringBuilder();
    int i = 0;
    while (i < dot.length()) {
      char c = dot.charAt(i);
      if (c != '"') {
        outside.append(c);
        i++;
        continue;
      }
      StringBuilder s = new StringBuilder();
      i++;
      while (i < dot.length() && dot.charAt(i) != '"') {
        if (dot.charAt(i) == '\\' && i + 1 < dot.length()) s.append(dot.charAt(i++));
        s.append(dot.charAt(i++));
      }
      assertThat(i).as("unterminated DOT string in\n%s", dot).isLessThan(dot.length());
      i++;
      strings.add(s.toString());
      outside.append("\"\"");
    }
    return outside.toString();
  }

  /** Undoes DOT backslash escapes, then the XML entities, then {@code <U+XXXX>} code points. */
  static String decodeDotLabel(String label) {
    StringBuilder s = new StringBuilder();
    for (int i = 0; i < label.length(); i++) {
      char c = label.charAt(i);
      if (c == '\\' && i + 1 < label.length()) {
        char n = label.charAt(++i);
        s.append(n == 'n' || n == 'l' || n == 'r' ? '\n' : n);
      } else {
        s.append(c);
      }
    }
    String e = s.toString().replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&amp;", "&");
    return java.util.regex.Pattern.compile("<U\\+([0-9A-Fa-f]{4,6})>").matcher(e)
        .replaceAll(m -> java.util.regex.Matcher.quoteReplacement(new String(Character.toChars(Integer.parseInt(m.group(1), 16)))));
  }

  private static int count(String s, char c) {
    return (int) s.chars().filter(x -> x == c).count();
  }

  private static void collectStrings(JsonNode n, Set<String> out) {
    if (n.isTextual()) out.add(n.asText());
    n.forEach(child -> collectStrings(child, out));
  }

  static void writeCsv(Path p, List<String[]> rows) throws IOException {
    try (Writer w = Files.newBufferedWriter(p, StandardCharsets.UTF_8);
        CSVWriter csv = new CSVWriter(w, ',', '"', '"', "\n")) {
      csv.writeAll(rows);
    }
  }

  /** Rows as header name → cell, read with an RFC 4180 parser. */
  static List<Map<String, String>> readCsv(Path p) throws IOException {
    try (CSVReader r = new CSVReaderBuilder(Files.newBufferedReader(p, StandardCharsets.UTF_8))
        .withCSVParser(new RFC4180ParserBuilder().build()).withKeepCarriageReturn(true).build()) {
      List<String[]> all = r.readAll();
      List<Map<String, String>> out = new ArrayList<>();
      String[] header = all.get(0);
      for (int i = 1; i < all.size(); i++) {
        Map<String, String> row = new LinkedHashMap<>();
        for (int c = 0; c < header.length; c++) row.put(header[c], c < all.get(i).length ? all.get(i)[c] : null);
        out.add(row);
      }
      return out;
    } catch (com.opencsv.exceptions.CsvException e) {
      throw new IOException(e);
    }
  }

  private static Map<String, Map<String, String>> rowsBy(List<Map<String, String>> rows, String column) {
    Map<String, Map<String, String>> out = new HashMap<>();
    for (Map<String, String> r : rows) out.put(r.get(column), r);
    return out;
  }
}
