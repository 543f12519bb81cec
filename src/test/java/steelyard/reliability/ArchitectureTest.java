package steelyard.reliability;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Bytecode rules over the main classes (ArchUnit): no network code at all, and the package arrows of
 * DEVELOPERS.md ("The data's way through the packages") point one way.
 */
class ArchitectureTest {
  static JavaClasses main;

  @BeforeAll
  static void importMainClasses() {
    main = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPackages("steelyard");
  }

  @Test
  void noClassOpensSocketsOrUrlConnections() {
    noClasses().should().dependOnClassesThat().haveFullyQualifiedName("java.net.Socket")
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
        .because("the tool has no network code at all (no sockets, no URL connections)")
        .check(main);
  }

  @Test
  void coreNeverDependsOnTheCommandLineOrTheWindow() {
    noClasses().that().resideInAnyPackage("steelyard.io..", "steelyard.text..", "steelyard.lm..", "steelyard.lattice..",
            "steelyard.rescore..", "steelyard.eval..", "steelyard.report..", "steelyard.tune..", "steelyard.audit..")
        .should().dependOnClassesThat().resideInAnyPackage("steelyard.cli..", "steelyard.gui..")
        .because("DEVELOPERS.md: the core never imports cli or gui")
        .check(main);
  }

  @Test
  void importDependsOnNoDownstreamPackage() {
    noClasses().that().resideInAPackage("steelyard.io..")
        .should().dependOnClassesThat().resideInAnyPackage("steelyard.text..", "steelyard.lm..", "steelyard.lattice..",
            "steelyard.rescore..", "steelyard.eval..", "steelyard.tune..", "steelyard.audit..", "steelyard.report..",
            "steelyard.demo..")
        .because("DEVELOPERS.md: io is the first package on the data's way")
        .check(main);
  }

  @Test
  void textDependsOnlyOnImport() {
    noClasses().that().resideInAPackage("steelyard.text..")
        .should().dependOnClassesThat().resideInAnyPackage("steelyard.lm..", "steelyard.lattice..", "steelyard.rescore..",
            "steelyard.eval..", "steelyard.tune..", "steelyard.audit..", "steelyard.report..")
        .because("DEVELOPERS.md: text comes right after io")
        .check(main);
  }

  @Test
  void languageModelDoesNotDependOnRescoringOrScoring() {
    noClasses().that().resideInAPackage("steelyard.lm..")
        .should().dependOnClassesThat().resideInAnyPackage("steelyard.lattice..", "steelyard.rescore..", "steelyard.eval..",
            "steelyard.tune..", "steelyard.audit..", "steelyard.report..")
        .because("DEVELOPERS.md: lm comes before lattice, rescore and eval")
        .check(main);
  }
}
