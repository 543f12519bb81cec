package steelyard.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Set;
import picocli.CommandLine;
import picocli.CommandLine.IParameterPreprocessor;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.ParseResult;

/**
 * Spellings of commands and options from release 0.1 that were renamed, still accepted for one release so
 * that scripts keep working. Each old spelling is hidden from the help, behaves exactly like its new
 * spelling, and prints one line on stderr naming the new one. Nothing Steelyard writes uses them.
 *
 * <p>Options whose meaning changed as well as their name (such as {@code lm train --cutoffs}) are not here:
 * their command keeps them as a hidden option and translates the value.
 */
final class OldSpellings {
  /** A subcommand of {@code parent} (a qualified name such as {@code steelyard lm}) renamed from {@code old}. */
  record Command(String parent, String old, String current) {}

  /**
   * An option renamed from {@code old} to {@code current}, in every command that has {@code current}, or only in
   * {@code commands} (qualified names, old command names included) when that set is not empty.
   */
  record Option(String old, String current, Set<String> commands) {}

  static final List<Command> COMMANDS = List.of(
      new Command("steelyard lm", "convert", "copy"),
      new Command("steelyard lm", "info", "describe"));

  static final List<Option> OPTIONS = List.of(
      new Option("--unk-log10", "--oov-log10-prob", Set.of()),
      new Option("--posterior-scale", "--posterior-sharpness", Set.of()),
      new Option("--text", "--corpus", Set.of("steelyard lm train")));

  private OldSpellings() {}

  /** Adds the old spellings, hidden, to the command tree of {@code root}. Call before configuring {@code root}. */
  static void install(CommandLine root) {
    for (Command c : COMMANDS) addOldCommand(find(root, c.parent()), c);
    installOptions(root);
  }

  /** Prints the warning for every old command name in {@code parsed}'s chain of subcommands. */
  static void warnAboutCommands(ParseResult parsed) {
    for (ParseResult p = parsed; p.hasSubcommand(); p = p.subcommand()) {
      CommandSpec sub = p.subcommand().commandSpec();
      for (Command c : COMMANDS) {
        if (p.commandSpec().qualifiedName().equals(c.parent()) && sub.name().equals(c.old()))
          warn(sub.commandLine().getErr(), "'" + c.parent() + " " + c.old() + "'", "'" + c.parent() + " " + c.current() + "'");
      }
    }
  }

  /** The one-line notice for an old spelling. */
  static String notice(String old, String current) {
    return "steelyard: warning: " + old + " is an old spelling, accepted for one more release; use " + current;
  }

  private static void warn(PrintWriter err, String old, String current) {
    err.println(notice(old, current));
    err.flush();
  }

  /** The command named {@code qualifiedName} ({@code steelyard lm}: the root, then subcommand names). */
  private static CommandLine find(CommandLine root, String qualifiedName) {
    CommandLine cl = root;
    String[] names = qualifiedName.split(" ");
    for (int i = 1; i < names.length && cl != null; i++) cl = cl.getSubcommands().get(names[i]);
    if (cl == null) throw new IllegalStateException("no command " + qualifiedName);
    return cl;
  }

  private static void addOldCommand(CommandLine parent, Command c) {
    CommandLine current = parent.getSubcommands().get(c.current());
    if (current == null) throw new IllegalStateException("no command " + c.current() + " under " + c.parent());
    Object instance;
    try {
      instance = parent.getFactory().create(current.getCommandSpec().userObject().getClass());
    } catch (Exception e) {
      throw new IllegalStateException("cannot create the command behind " + c.old(), e);
    }
    CommandLine old = new CommandLine(instance, parent.getFactory());
    old.getCommandSpec().name(c.old()).usageMessage().hidden(true);
    parent.addSubcommand(c.old(), old);
  }

  private static void installOptions(CommandLine cl) {
    CommandSpec spec = cl.getCommandSpec();
    for (Option o : OPTIONS) {
      OptionSpec current = spec.findOption(o.current());
      if (current == null || spec.findOption(o.old()) != null) continue;
      if (!o.commands().isEmpty() && !o.commands().contains(spec.qualifiedName())) continue;
      spec.addOption(alias(cl, o, current));
    }
    for (CommandLine sub : cl.getSubcommands().values()) {
      if (sub != cl) installOptions(sub);
    }
  }

  /**
   * A hidden option named {@code o.old()} that warns and hands its value to {@code current}: it puts the new
   * name back on the argument stack in its place, so {@code current} is matched as if it had been written
   * (required-option checks, value conversion and repeated-option checks included).
   */
  private static OptionSpec alias(CommandLine cl, Option o, OptionSpec current) {
    IParameterPreprocessor rename = (args, spec, arg, info) -> {
      warn(cl.getErr(), o.old(), o.current());
      args.push(o.current());
      return true;
    };
    return OptionSpec.builder(o.old())
        .hidden(true)
        .type(current.type())
        .auxiliaryTypes(current.auxiliaryTypes())
        .arity(current.arity())
        .paramLabel(current.paramLabel())
        .description("Old spelling of " + o.current() + ".")
        .preprocessor(rename)
        .hasInitialValue(false)
        .build();
  }
}
