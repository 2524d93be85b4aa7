package org.viewgain.docs;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.viewgain.classify.ClassifierRegistry;
import org.viewgain.imputation.ImputerRegistry;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.spec.ParamDef;

/** The README documents every method and parameter the registries accept, and the demo spec is one file. */
class ReadmeTest {
    static String readme() throws IOException {
        return Files.readString(Path.of("README.md"));
    }

    @Test
    void givenRegistries_whenReadmeRead_thenEveryMethodAndParameterIsDocumented() throws IOException {
        String text = readme();
        for (String m : ImputerRegistry.methods()) {
            assertTrue(text.contains("`" + m + "`"), "imputer " + m);
            ViewImputer imp = ImputerRegistry.byMethod(m);
            for (ParamDef d : imp.parameters()) {
                assertTrue(text.contains("`" + d.name() + "`"), m + "." + d.name());
            }
        }
        for (String m : ClassifierRegistry.methods()) {
            assertTrue(text.contains("`" + m + "`"), "classifier " + m);
            if (!m.equals("weka")) {
                for (ParamDef d : ClassifierRegistry.create(m).parameters()) {
                    assertTrue(text.contains("`" + d.name() + "`"), m + "." + d.name());
                }
            }
        }
    }

    @Test
    void givenDemoSpec_whenPackagedCopyRead_thenItEqualsTheCommittedSpec() throws IOException {
        try (InputStream in = ReadmeTest.class.getResourceAsStream("/org/viewgain/demo/demo.yaml")) {
            assertArrayEquals(Files.readAllBytes(Path.of("experiment-specs/demo.yaml")), in.readAllBytes());
        }
    }
}
