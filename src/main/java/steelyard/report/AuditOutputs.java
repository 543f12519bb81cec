package steelyard.report;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.io.JsonOutput;
import steelyard.report.html.HtmlReport;
import steelyard.report.html.ReportModel;

/**
 * The files of an audit, each format chosen by the name's extension: {@code .json} ({@link AuditJson}), {@code .csv}
 * ({@link AuditCsv}, spreadsheet-safe unless switched off) and {@code .html} (the self-contained report,
 * {@link HtmlReport}); {@code -} is standard output in a format named separately.
 *
 * <p>All or none: {@link #plan} checks every name and directory before the run, and {@link #write} renders every
 * file in memory before writing the first, each atomically ({@link AtomicOutput}), so a bad output name, a missing
 * directory or a failure while rendering leaves no output file behind.
 */
public final class AuditOutputs {
  /** An output format. */
  public enum Format {
    JSON, CSV, HTML;

    /** The format named {@code json}, {@code csv} or {@code html} (any case); null for anything else. */
    public static Format named(String name) {
      for (Format f : values()) if (f.name().equalsIgnoreCase(name)) return f;
      return null;
    }

    public String label() {
      return name().toLowerCase(Locale.ROOT);
    }
  }

  private final Map<Path, Format> files;

  private AuditOutputs(Map<Path, Format> files) {
    this.files = files;
  }

  /**
   * The outputs {@code targets}, formats from their extensions ({@code -}: {@code stdoutFormat}), after checking them
   * against each other and {@code inputs} ({@link OutputPaths#refuseClashes}) and checking that each can be created.
   * Problems are {@link InputException}s naming {@code option}.
   */
  public static AuditOutputs plan(String option, List<Path> targets, Format stdoutFormat, List<Path> inputs) {
    if (targets.isEmpty()) throw InputException.option(option, "no output named", "at least one FILE.json, FILE.csv or FILE.html");
    Map<String, Path> byOption = new LinkedHashMap<>();
    Map<Path, Format> files = new LinkedHashMap<>();
    for (int k = 0; k < targets.size(); k++) {
      Path p = targets.get(k);
      byOption.put(targets.size() == 1 ? option : option + " (" + (k + 1) + ")", p);
      files.put(p, OutputPaths.isStdout(p) ? stdoutFormat : format(option, p));
    }
    OutputPaths.refuseClashes(byOption, inputs);
    OutputPaths.requireWritable(files.keySet());
    return new AuditOutputs(files);
  }

  private static Format format(String option, Path p) {
    String name = p.getFileName() == null ? "" : p.getFileName().toString();
    int dot = name.lastIndexOf('.');
    Format f = dot < 0 ? null : Format.named(name.substring(dot + 1));
    if (f == null)
      throw InputException.option(option, "cannot tell the format of '" + p + "' from its name",
          "a name ending in .json, .csv or .html, or '-' for standard output");
    return f;
  }

  /** Whether any output is the HTML report (which needs the chart series). */
  public boolean wantsHtml() {
    return files.containsValue(Format.HTML);
  }

  /** Whether one of the outputs is standard output. */
  public boolean usesStdout() {
    return files.keySet().stream().anyMatch(OutputPaths::isStdout);
  }

  /**
   * Renders every output, then writes each atomically ({@code -} to {@code stdout}).
   *
   * @param html the report's model; read only when an HTML output is planned (may be null otherwise)
   */
  public void write(AuditRun.Result r, ReportModel html, boolean spreadsheetSafe, Writer stdout) {
    List<String> texts = new ArrayList<>(files.size());
    for (Format f : files.values()) texts.add(render(f, r, html, spreadsheetSafe));
    int k = 0;
    for (Path p : files.keySet()) {
      String text = texts.get(k++);
      AtomicOutput.writeText(p, stdout, w -> w.write(text));
    }
  }

  private static String render(Format f, AuditRun.Result r, ReportModel html, boolean spreadsheetSafe) {
    return switch (f) {
      case JSON -> JsonOutput.render(AuditJson.json(r.audit()));
      case HTML -> HtmlReport.render(html);
      case CSV -> {
        StringWriter w = new StringWriter();
        try {
          AuditCsv.write(w, r.audit(), spreadsheetSafe);
        } catch (IOException e) {
          throw new UncheckedIOException(e);
        }
        yield w.toString();
      }
    };
  }
}
