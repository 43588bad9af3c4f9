package org.tufa.analysis.fleet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class FolderNamesTest {

    @Test
    void hostileIrisStayInsideTheOutputFolder() {
        FolderNames names = new FolderNames();
        Path out = Path.of("/tmp/out");
        for (String iri : new String[] {"urn:x#../../etc", "urn:x#..", "urn:x#.", "urn:x#a/../../b", "urn:x#",
                "urn:x#C:\\windows", "urn:x#%2e%2e"}) {
            String name = names.next(iri);
            Path p = out.resolve(name).normalize();
            assertTrue(p.startsWith(out) && !p.equals(out), iri + " -> " + name);
            assertFalse(name.contains("/") || name.contains("\\") || name.startsWith("."), name);
        }
    }

    @Test
    void collisionsAfterSanitisingAreMadeUnique() {
        FolderNames names = new FolderNames();
        assertEquals("FCU_1", names.next("urn:a#FCU 1"));
        assertEquals("FCU_1_2", names.next("urn:b#FCU?1"));
        assertEquals("fcu_1_3", names.next("urn:c#fcu_1"));
    }

    @Test
    void localNameAfterHashSlashOrColon() {
        assertEquals("FCU-03-07", FolderNames.localName("https://example.org/b#FCU-03-07"));
        assertEquals("u1", FolderNames.localName("urn:site:u1"));
    }
}
