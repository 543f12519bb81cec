package steelyard.cli;

import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.io.OutputSet;

/**
 * The {@code steelyard} command line: one root command, one class per subcommand.
 *
 * <p>Exit codes: {@value #OK} success, {@value #BAD_INPUT} bad input or usage (a one-line
 * {@code file:line: problem; expected …} message, no stack trace), {@value #INTERNAL} internal failure.
 */
@Command(
    name = "steelyard",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = "Pick, tune and audit transcripts among competing recogniser outputs with an n-gram language model.",
    subcommands = {
      DemoCommand.class,
      ScoreCommand.class,
      CompareCommand.class,
      LmCommand.class,
      RescoreCommand.class,
      TuneCommand.class,
      AuditCommand.class,
      NetworkCommand.class,
      RunsCommand.class,
      DemoDataCommand.class,
      GuiCommand.class,
      CommandLine.HelpCommand.class
    })
public final class Main implements Runnable {
  public static final int OK = 0;
  public static final int INTERNAL = 1;
  public static final int BAD_INPUT = 2;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "a command is required; see 'steelyard --help'");
  }

  public static void main(String[] args) {
    System.exit(run(args));
  }

  /** Runs the command line and returns its exit code (used by tests to run in-process). */
  public static int run(String... args) {
    return commandLine().execute(args);
  }

  /** The configured command line, with the project's exit codes and error printing. */
  public static CommandLine commandLine() {
    CommandLine cl = new CommandLine(new Main());
    OldSpellings.install(cl);
    cl.setExecutionStrategy(Main::execute);
    cl.setExecutionExceptionHandler(Main::handleExecutionException);
    cl.setParameterExceptionHandler(Main::handleParameterException);
    cl.setCaseInsensitiveEnumValuesAllowed(true);
    // Every command prints through these (never System.out/err), in UTF-8 whatever the platform charset.
    cl.setOut(new PrintWriter(new OutputStreamWriter(System.out, StandardCharsets.UTF_8), true));
    cl.setErr(new PrintWriter(new OutputStreamWriter(System.err, StandardCharsets.UTF_8), true));
    return cl;
  }

  /**
   * Runs the command after the notices about old spellings, with the output layer's notices on the command's
   * stderr; a command that fails leaves no output set open (its temporary files are deleted, its targets
   * untouched).
   */
  private static int execute(CommandLine.ParseResult parsed) {
    OldSpellings.warnAboutCommands(parsed);
    long mark = OutputSet.mark();
    PrintWriter err = parsed.commandSpec().commandLine().getErr();
    return AtomicOutput.withNotices(line -> {
      err.println(line);
      err.flush();
    }, () -> {
      try {
        return new CommandLine.RunLast().execute(parsed);
      } finally {
        OutputSet.discardOpenedSince(mark);
      }
    });
  }

  private static int handleExecutionException(Exception e, CommandLine cl, CommandLine.ParseResult parsed) {
    PrintWriter err = cl.getErr();
    InputException input = findInputException(e);
    if (input != null) {
      err.println("steelyard: " + input.getMessage());
      err.flush();
      return BAD_INPUT;
    }
    err.println("steelyard: internal error (please report it with the command that caused it): " + e);
    e.printStackTrace(err);
    err.flush();
    return INTERNAL;
  }

  private static int handleParameterException(CommandLine.ParameterException e, String[] args) {
    PrintWriter err = e.getCommandLine().getErr();
    err.println("steelyard: " + e.getMessage());
    err.println("(see '" + e.getCommandLine().getCommandSpec().qualifiedName() + " --help')");
    err.flush();
    return BAD_INPUT;
  }

  private static InputException findInputException(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause()) {
      if (t instanceof InputException) return (InputException) t;
    }
    return null;
  }
}
