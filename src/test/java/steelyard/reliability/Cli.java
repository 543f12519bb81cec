package steelyard.reliability;


import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;
import picocli.CommandLine;
import steelyard.cli.Main;

/**
 * Runs the real command line, in-process (with {@code CommandLine.setOut/setErr} capturing its output), or in a
 * child JVM for the few checks that must kill or isolate the process.
 */
final class Cli {
  private Cli() {}

  /** What a run printed and returned. */
  record Result(int exit, String out, String err) {
    /** Lines on stderr that are messages (not warnings, not progress, not the usage hint). */
    List<String> messageLines() {
      List<String> out = new ArrayList<>();
      for (String line : err.split("\r?\n")) {
        if (line.isBlank()) continue;
        if (line.startsWith("steelyard: warning:") || line.startsWith("steelyard: skipped ")) continue;
        if (line.startsWith("(see '")) continue;
        out.add(line);
      }
      return out;
    }

    /** True when the command (or a part it calls) throws the skeleton placeholder's "not built yet". */
    boolean notBuiltYet() {
      return exit == Main.INTERNAL && err.contains("not built yet");
    }

    @Override
    public String toString() {
      return "exit " + exit + "\n--- stdout ---\n" + clip(out) + "\n--- stderr ---\n" + clip(err);
    }
  }

  /** Runs {@code args} in-process with the command line's own output writers captured (commands print only through them). */
  static Result run(String... args) {
    CommandLine cl = Main.commandLine();
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    int code = cl.execute(args);
    return new Result(code, out.toString(), err.toString());
  }

  /** Runs {@code args} and fails the calling test when the command answers as an unbuilt placeholder. */
  static Result runBuilt(String... args) {
    Result r = run(args);
    requireBuilt(r, args);
    return r;
  }

  /**
   * Fails (never skips) when a command or a part it calls still throws the skeleton's "not built yet": every
   * command exists, so such an answer is a regression.
   */
  static void requireBuilt(Result r, String... args) {
    if (r.notBuiltYet())
      throw new AssertionError("command '" + commandName(args) + "' (or a part it uses) answers 'not built yet': " + firstLine(r.err));
  }

  static String commandName(String... args) {
    StringBuilder sb = new StringBuilder();
    for (String a : args) {
      if (a.startsWith("-")) break;
      if (sb.length() > 0) sb.append(' ');
      sb.append(a);
    }
    return sb.toString();
  }

  /** The command for a child JVM running {@code steelyard.cli.Main} with the test class path. */
  static List<String> childCommand(List<String> jvmOptions, String... args) {
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.addAll(jvmOptions);
    cmd.add("-cp");
    cmd.add(testClassPath());
    cmd.add("steelyard.cli.Main");
    cmd.addAll(Arrays.asList(args));
    return cmd;
  }

  /** Starts a child JVM; its stdout and stderr go to the given files. */
  static Process start(List<String> jvmOptions, Path stdout, Path stderr, String... args) {
    return start(jvmOptions, null, stdout, stderr, args);
  }

  /** Starts a child JVM in working directory {@code cwd} (null: this one's). */
  static Process start(List<String> jvmOptions, Path cwd, Path stdout, Path stderr, String... args) {
    try {
      return new ProcessBuilder(childCommand(jvmOptions, args))
          .directory(cwd == null ? null : cwd.toFile())
          .redirectOutput(stdout.toFile())
          .redirectError(stderr.toFile())
          .start();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Runs a child JVM to completion (bounded by {@code timeoutSeconds}). */
  static Result runChild(List<String> jvmOptions, Path scratch, long timeoutSeconds, String... args) throws Exception {
    Path out = Files.createTempFile(scratch, "child", ".out");
    Path err = Files.createTempFile(scratch, "child", ".err");
    Process p = start(jvmOptions, out, err, args);
    if (!p.waitFor(timeoutSeconds, TimeUnit.SECONDS)) {
      p.destroyForcibly().waitFor();
      throw new AssertionError("child JVM did not finish in " + timeoutSeconds + " s: " + String.join(" ", args));
    }
    Result r = new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
    Files.delete(out);
    Files.delete(err);
    return r;
  }

  /**
   * The test run's class path: target/classes, target/test-classes and the dependencies. Surefire passes it as
   * {@code surefire.test.class.path} (its own {@code java.class.path} may be a manifest-only jar).
   */
  static String testClassPath() {
    String cp = System.getProperty("surefire.test.class.path");
    if (cp == null || cp.isBlank()) cp = System.getProperty("java.class.path");
    Path classes = Path.of("target", "classes").toAbsolutePath();
    if (!cp.contains(classes.toString())) cp = classes + File.pathSeparator + cp;
    return cp;
  }

  static String firstLine(String s) {
    int nl = s.indexOf('\n');
    return nl < 0 ? s : s.substring(0, nl);
  }

  private static String clip(String s) {
    return s.length() <= 4000 ? s : s.substring(0, 4000) + "… (" + s.length() + " chars)";
  }
}
