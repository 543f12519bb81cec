package steelyard.reliability;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;

import com.tngtech.archunit.ArchConfiguration;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import steelyard.cli.Main;
import java.net.URISyntaxException;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Bytecode rules over the main classes (ArchUnit): no network code at all, and the package arrows of
 * DEVELOPERS.md ("The data's way through the packages") point one way.
 */
class ArchitectureTest {
  static JavaClasses main;

  private static boolean resolvedFromClassPath;

  /**
   * Imports target/classes only; dependencies outside it (the JDK, libraries) are kept as names without being
   * imported themselves, which is all these rules need and keeps the import fast.
   */
  @BeforeAll
  static void importMainClasses() {
    resolvedFromClassPath = ArchConfiguration.get().resolveMissingDependenciesFromClassPath();
    ArchConfiguration.get().setResolveMissingDependenciesFromClassPath(false);
    try {
      Path classes = Path.of(Main.class.getProtectionDomain().getCodeSource().getLocation().toURI());
      main = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPath(classes);
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  @AfterAll
  static void restoreConfiguration() {
    ArchConfiguration.get().setResolveMissingDependenciesFromClassPath(resolvedFromClassPath);
  }

  @Test
  void importedTheMainClasses() {
    org.assertj.core.api.Assertions.assertThat(main.contain("steelyard.cli.Main")).isTrue();
    org.assertj.core.api.Assertions.assertThat(main.stream().map(c -> c.getPackageName()).distinct().count()).isGreaterThan(3);
  }

  /** No dependency on socket or URL-connection classes, and no call opening a URL. */
  static final ArchRule NO_NETWORK = noClasses().should().dependOnClassesThat().haveFullyQualifiedName("java.net.Socket")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.net.ServerSocket")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.net.DatagramSocket")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.net.MulticastSocket")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.net.URLConnection")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.net.HttpURLConnection")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("javax.net.ssl.HttpsURLConnection")
      .orShould().dependOnClassesThat().resideInAPackage("java.net.http..")
      .orShould().dependOnClassesThat().resideInAPackage("javax.net..")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.nio.channels.SocketChannel")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.nio.channels.ServerSocketChannel")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.nio.channels.DatagramChannel")
      .orShould().dependOnClassesThat().haveFullyQualifiedName("java.nio.channels.AsynchronousSocketChannel")
      .orShould().callMethod(java.net.URL.class, "openConnection")
      .orShould().callMethod(java.net.URL.class, "openStream")
      .because("the tool has no network code at all (no sockets, no URL connections)");

  @Test
  void noClassOpensSocketsOrUrlConnections() {
    NO_NETWORK.check(main);
  }

  /**
   * The rule is not vacuous: it flags classes that merely mention a socket or a URL-connection type (they
   * hold such a field and never open anything).
   */
  @Test
  void theNetworkRuleFlagsAClassThatMentionsASocketType() {
    JavaClasses offenders = new ClassFileImporter().importClasses(MentionsSocket.class, MentionsHttpConnection.class);
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> NO_NETWORK.check(offenders))
        .isInstanceOf(AssertionError.class).hasMessageContaining("MentionsSocket").hasMessageContaining("MentionsHttpConnection");
  }

  static final class MentionsSocket {
    java.net.Socket never;
  }

  static final class MentionsHttpConnection {
    java.net.HttpURLConnection never;
  }

  /**
   * The package map of DEVELOPERS.md ("The data's way through the packages"), bottom to top: each layer may use
   * only the layers listed for it. Layers not built yet (tune, gui) are optional, so the rule
   * holds before they exist and binds them once they do.
   */
  static final ArchRule PACKAGE_MAP = layeredArchitecture()
      .consideringOnlyDependenciesInLayers()
      .withOptionalLayers(true)
      .layer("io").definedBy("steelyard.io..")
      .layer("text").definedBy("steelyard.text..")
      .layer("lm").definedBy("steelyard.lm..")
      .layer("lattice").definedBy("steelyard.lattice..")
      .layer("eval").definedBy("steelyard.eval..")
      .layer("rescore").definedBy("steelyard.rescore..")
      .layer("tune").definedBy("steelyard.tune..")
      .layer("audit").definedBy("steelyard.audit..")
      .layer("report").definedBy("steelyard.report..")
      .layer("history").definedBy("steelyard.history..")
      .layer("demo").definedBy("steelyard.demo..")
      .layer("cli").definedBy("steelyard.cli..")
      .layer("gui").definedBy("steelyard.gui..")
      .whereLayer("io").mayNotAccessAnyLayer()
      .whereLayer("text").mayOnlyAccessLayers("io")
      .whereLayer("lm").mayOnlyAccessLayers("io", "text")
      .whereLayer("lattice").mayOnlyAccessLayers("io", "text", "lm")
      .whereLayer("eval").mayOnlyAccessLayers("io", "text")
      .whereLayer("rescore").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval")
      .whereLayer("tune").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore")
      .whereLayer("audit").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore")
      .whereLayer("report").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore", "tune", "audit")
      .whereLayer("history").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore", "tune", "audit", "report")
      .whereLayer("demo").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore", "tune", "audit", "report", "history")
      .whereLayer("cli").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore", "tune", "audit", "report", "history",
          "demo", "gui")
      .whereLayer("gui").mayOnlyAccessLayers("io", "text", "lm", "lattice", "eval", "rescore", "tune", "audit", "report", "history",
          "demo", "cli")
      .because("DEVELOPERS.md: arrows point one way, and the core never imports cli or gui");

  @Test
  void packagesFollowTheLayersOfThePackageMap() {
    PACKAGE_MAP.check(main);
  }

  /** The rule is not vacuous: an io class that uses the command line breaks it. */
  @Test
  void thePackageMapFlagsAnIoClassThatUsesTheCommandLine() {
    JavaClasses offender = new ClassFileImporter().importClasses(steelyard.io.LayerViolationProbe.class, Main.class);
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> PACKAGE_MAP.check(offender))
        .isInstanceOf(AssertionError.class).hasMessageContaining("LayerViolationProbe");
  }
}
