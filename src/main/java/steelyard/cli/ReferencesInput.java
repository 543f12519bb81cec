package steelyard.cli;

import java.nio.file.Path;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code --refs FILE}: the references file of every command that scores against references. */
public final class ReferencesInput {
  @Spec(Spec.Target.MIXEE) CommandSpec mixee;

  @Option(names = "--refs", paramLabel = "FILE",
      description = "References CSV (utt_id,text[,group]; .gz accepted); error rates need it.")
  public Path refs;

  /** The file; a usage error (as for a missing required option) when the command needs one and none is given. */
  public Path require() {
    if (refs == null) throw new CommandLine.ParameterException(mixee.commandLine(), "Missing required option: '--refs=FILE'");
    return refs;
  }
}
