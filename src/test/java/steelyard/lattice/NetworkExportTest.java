package steelyard.lattice;

import static org.assertj.core.api.Assertions.assertThat;

import com.opencsv.CSVReader;
import com.opencsv.CSVReaderBuilder;
import com.opencsv.RFC4180ParserBuilder;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

class NetworkExportTest {
  private static final List<String> HOSTILE = List.of(
      "<script>alert(1)</script>", "say \"hi\"", "a,b", "line1\nline2", "cr\rlf", "=SUM(A1:A9)", "back\\slash\\",
      "\u200Fright\u202Eleft\u2066", "cre\u0301me", "tab\there", "&amp;", "\"", "\\\"];} digraph x {", "sep\u2028x",
      "\u0000nul", "plums");

  private static ConfusionNetwork hostileNetwork() {
    List<List<String>> hyps = new ArrayList<>();
    double[] p = new double[HOSTILE.size()];
    for (int i = 0; i < HOSTILE.size(); i++) {
      hyps.add(i % 2 == 0 ? List.of(HOSTILE.get(i), "crates") : List.of(HOSTILE.get(i)));
      p[i] = 1.0 / HOSTILE.size();
    }
    return ConfusionNetwork.build(hyps, p, 100);
  }

  // DOT grammar subset we emit (Graphviz language reference: a quoted string holds any character but an
  // unescaped '"'; the escapes \" and \\ and \n). Every line must match one of these.
  private static final String QUOTED = "\"(?:[^\"\\\\\\n\\r]|\\\\[\"\\\\n])*\"";
  private static final Pattern EDGE = Pattern.compile("  b\\d+ -> b\\d+ \\[label=(" + QUOTED + ")(?:, style=dashed)?(?:, penwidth=3)?\\];");
  private static final Pattern OTHER = Pattern.compile(
      "digraph confusion_network \\{|  graph \\[rankdir=LR(?:, label=" + QUOTED + ", labelloc=t)?\\];|  node \\[[^\\]\"]*label=\"\"\\];|  b\\d+;|\\}");

  @Test
  void dotStaysWellFormedWhateverTheTokens() throws Exception {
    StringWriter w = new StringWriter();
    NetworkExport.writeDot(hostileNetwork(), "utt \"7\"\n<b>", w);
    String dot = w.toString();
    List<String> labels = new ArrayList<>();
    for (String line : dot.split("\n", -1)) {
      if (line.isEmpty()) continue;
      Matcher m = EDGE.matcher(line);
      if (m.matches()) labels.add(m.group(1));
      else assertThat(line).as("a line outside the emitted grammar").matches(OTHER);
    }
    assertThat(dot).endsWith("}\n");
    dot.codePoints().forEach(cp -> assertThat(cp == '\n' || (!Character.isISOControl(cp) && Character.getType(cp) != Character.FORMAT
        && cp != 0x2028)).as("raw control or format character U+%04X in DOT", cp).isTrue());
    // Decode each label with the test's own inverse of the documented escaping and find every token.
    List<String> decoded = new ArrayList<>();
    for (String l : labels) {
      String body = l.substring(1, l.length() - 1);
      body = body.substring(0, body.lastIndexOf("\\n"));
      decoded.add(body.replace("\\\"", "\"").replace("\\\\", "\\").replace("&lt;", "<").replace("&gt;", ">").replace("&amp;", "&"));
    }
    assertThat(decoded).contains("<script>alert(1)</script>", "say \"hi\"", "=SUM(A1:A9)", "back\\slash\\", "cre\u0301me",
        "&amp;", "\"", "\\\"];} digraph x {", "line1<U+000A>line2", "<U+200F>right<U+202E>left<U+2066>", "<U+0000>nul", "(empty)");
  }

  @Test
  void csvKeepsRawTokensExactlyUnderRfc4180Quoting() throws Exception {
    ConfusionNetwork net = hostileNetwork();
    StringWriter w = new StringWriter();
    NetworkExport.writeCsv(net, w);
    List<String[]> rows;
    // opencsv's RFC 4180 parser: the default parser treats backslash as an escape, which RFC 4180 does not.
    try (CSVReader r = new CSVReaderBuilder(new StringReader(w.toString()))
        .withCSVParser(new RFC4180ParserBuilder().build()).withKeepCarriageReturn(true).build()) {
      rows = r.readAll();
    }
    assertThat(rows.get(0)).containsExactly("slot", "arc", "token", "empty", "posterior", "hypothesis_count", "hypotheses", "consensus");
    assertThat(rows).hasSize(net.arcCount() + 1);
    List<String> tokens = new ArrayList<>();
    for (String[] row : rows.subList(1, rows.size())) {
      assertThat(row).hasSize(8);
      if (row[3].equals("0")) tokens.add(row[2]);
    }
    assertThat(tokens).containsAll(HOSTILE).contains("crates");
    // RFC 4180 sec. 2: a field with a quote is quoted and the quote doubled.
    assertThat(w.toString()).contains("\"say \"\"hi\"\"\"").contains("\"a,b\"").contains("\"line1\nline2\"").contains("\"cr\rlf\"");
  }

  @Test
  void csvRowsCarryPosteriorsHypothesesAndTheConsensusArc() throws Exception {
    // Worked by hand: slot 1 "crates" 0.7 (inputs 0, 2), "crate" 0.3 (input 1).
    ConfusionNetwork net = ConfusionNetwork.build(
        List.of(List.of("ten", "crates"), List.of("ten", "crate"), List.of("ten", "crates")), new double[] {0.5, 0.3, 0.2}, 10);
    StringWriter w = new StringWriter();
    NetworkExport.writeCsv(net, w);
    assertThat(w.toString()).isEqualTo(String.join("\n",
        "slot,arc,token,empty,posterior,hypothesis_count,hypotheses,consensus",
        "0,0,ten,0,1.0000000000,3,0 1 2,1",
        "1,0,crates,0,0.7000000000,2,0 2,1",
        "1,1,crate,0,0.3000000000,1,1,0") + "\n");
  }

  @Test
  void sameNetworkGivesIdenticalBytes() throws Exception {
    StringWriter a = new StringWriter();
    StringWriter b = new StringWriter();
    NetworkExport.writeDot(hostileNetwork(), "u1", a);
    NetworkExport.writeDot(hostileNetwork(), "u1", b);
    assertThat(a.toString()).isEqualTo(b.toString());
  }
}
