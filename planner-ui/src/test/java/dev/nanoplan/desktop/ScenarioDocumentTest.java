package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.geometry.Vec3;
import dev.nanoplan.scenario.Scenario;
import dev.nanoplan.scenario.ScenarioReader;
import dev.nanoplan.scenario.Species;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The document without a window or a planner: undo/redo against an independently kept history,
 * the unsaved mark and title, the one "replaced" event per load, and the hook that sees every
 * layout before it is shown.
 */
class ScenarioDocumentTest {

    static final Path TANK = Path.of("..", "scenarios", "culture-tank.json");

    List<Scenario> shown;
    List<String> events;
    ScenarioDocument doc;
    Scenario tank;

    @BeforeEach
    void setUp() throws Exception {
        shown = new ArrayList<>();
        events = new ArrayList<>();
        doc = new ScenarioDocument(new RecentFiles(null), s -> {
            shown.add(s);
            events.add("before shown");
        });
        doc.onReplaced(() -> events.add("replaced while showing " + (doc.scenario() == null ? "nothing"
                : doc.scenario().name())));
        doc.onShown(s -> events.add("shown"));
        tank = ScenarioReader.strict().read(TANK);
    }

    Vec3 randomPlace(UniformRandomProvider rng) {
        return new Vec3(Math.rint(rng.nextDouble(30, 370)), Math.rint(rng.nextDouble(30, 370)),
                Math.rint(rng.nextDouble(30, 170)));
    }

    @Test
    void undoAndRedoFollowAnIndependentHistoryOfSeededMoves() {
        doc.load(tank, null);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7L);
        List<Scenario> history = new ArrayList<>(List.of(tank));
        List<String> ids = tank.nodes().stream().map(n -> n.id()).toList();
        while (history.size() < 21) {
            String id = ids.get(rng.nextInt(ids.size()));
            Vec3 p = randomPlace(rng);
            if (doc.edit("move " + id, (s, u) -> LayoutEdits.moveNode(s, u, id, p))) {
                history.add(doc.scenario());
            }
        }
        // undo walks the history back one layout at a time, redo forward again (the undo contract)
        for (int k = history.size() - 2; k >= 0; k--) {
            assertThat(doc.undo()).isTrue();
            assertThat(doc.scenario()).isEqualTo(history.get(k));
        }
        assertThat(doc.undo()).isFalse();
        for (int k = 1; k < history.size(); k++) {
            assertThat(doc.redo()).isTrue();
            assertThat(doc.scenario()).isEqualTo(history.get(k));
        }
        assertThat(doc.redo()).isFalse();
        assertThat(doc.messageProperty().get()).startsWith("redid move ");
    }

    @Test
    void aNewEditAfterUndoClearsTheRedoSide() {
        doc.load(tank, null);
        doc.edit("move s01", (s, u) -> LayoutEdits.moveNode(s, u, "s01", new Vec3(60, 60, 60)));
        doc.undo();
        assertThat(doc.undoStack().canRedoProperty().get()).isTrue();
        doc.edit("move s02", (s, u) -> LayoutEdits.moveNode(s, u, "s02", new Vec3(70, 70, 70)));
        assertThat(doc.undoStack().canRedoProperty().get()).isFalse();
        assertThat(doc.redo()).isFalse();
    }

    @Test
    void editsMarkTheDocumentUnsavedAndSavingClearsTheMark(@TempDir Path dir) throws Exception {
        doc.load(tank, null);
        assertThat(doc.dirtyProperty().get()).isFalse();
        assertThat(doc.titleProperty().get()).isEqualTo(tank.name() + " — nanoplan");
        doc.edit("move s01", (s, u) -> LayoutEdits.moveNode(s, u, "s01", new Vec3(60, 60, 60)));
        assertThat(doc.dirtyProperty().get()).isTrue();
        assertThat(doc.titleProperty().get()).isEqualTo("• " + tank.name() + " — nanoplan");
        assertThat(doc.save()).isFalse(); // no file yet
        Path out = dir.resolve("tank.json");
        assertThat(doc.saveAs(out)).isTrue();
        assertThat(doc.dirtyProperty().get()).isFalse();
        assertThat(doc.titleProperty().get()).isEqualTo("tank.json — nanoplan");
        assertThat(doc.fileProperty().get()).isEqualTo(out);
        // the saved file is read back by planner-core's own reader as the edited layout
        assertThat(ScenarioReader.strict().read(out)).isEqualTo(doc.scenario());
        assertThat(Files.exists(out)).isTrue();
    }

    @Test
    void aRefusedEditChangesNothingAndSaysWhy() {
        doc.load(tank, null);
        int shownBefore = shown.size();
        assertThat(doc.edit("delete ghost", (s, u) -> LayoutEdits.deleteNode(s, u, "ghost"))).isFalse();
        assertThat(doc.messageProperty().get()).isEqualTo("delete ghost refused: no node 'ghost'");
        assertThat(doc.scenario()).isSameAs(tank);
        assertThat(shown).hasSize(shownBefore);
        assertThat(doc.undoStack().canUndoProperty().get()).isFalse();
        assertThat(doc.dirtyProperty().get()).isFalse();
        // an edit that changes nothing is no edit either
        assertThat(doc.edit("nothing", s -> s)).isFalse();
        assertThat(doc.undoStack().canUndoProperty().get()).isFalse();
    }

    @Test
    void loadingFiresOneReplacedEventBeforeTheNewLayoutIsShown() {
        doc.load(tank, null);
        assertThat(events).containsExactly("replaced while showing nothing", "before shown", "shown");
        events.clear();
        doc.edit("move s01", (s, u) -> LayoutEdits.moveNode(s, u, "s01", new Vec3(60, 60, 60)));
        doc.undo();
        // edits and undo are not replacements
        assertThat(events).containsExactly("before shown", "shown", "before shown", "shown");
        events.clear();
        assertThat(doc.open(TANK)).isTrue();
        assertThat(events).containsExactly("replaced while showing " + tank.name(), "before shown", "shown");
        assertThat(doc.undoStack().canUndoProperty().get()).isFalse();
        assertThat(doc.messageProperty().get()).isEqualTo("opened culture-tank.json");
    }

    @Test
    void aFailedOpenKeepsTheLayoutAndFiresNothing(@TempDir Path dir) throws Exception {
        doc.load(tank, null);
        events.clear();
        Path bad = Files.writeString(dir.resolve("bad.json"), "{ not json");
        assertThat(doc.open(bad)).isFalse();
        assertThat(doc.messageProperty().get()).startsWith("cannot open " + bad + ": ");
        assertThat(events).isEmpty();
        assertThat(doc.scenario()).isSameAs(tank);
    }

    @Test
    void anEditOfTheUnusedSpeciesAloneIsShownAgain() {
        doc.load(tank, null);
        shown.clear();
        Species c = Species.ofDiffusion("C", 120, 4);
        assertThat(doc.commit("add species C", tank, tank, List.of(c))).isTrue();
        // the layout record is unchanged, yet the hook sees it so the planner and editor can follow
        assertThat(shown).containsExactly(tank);
        assertThat(doc.unusedSpecies()).containsExactly(c);
        assertThat(doc.undo()).isTrue();
        assertThat(doc.unusedSpecies()).isEmpty();
    }
}
