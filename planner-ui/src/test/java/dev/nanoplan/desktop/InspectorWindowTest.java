package dev.nanoplan.desktop;

import static org.assertj.core.api.Assertions.assertThat;

import dev.nanoplan.scenario.Node;
import dev.nanoplan.scenario.ReceiverModel;
import dev.nanoplan.scenario.Schedule;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javafx.scene.Parent;
import javafx.scene.control.Alert;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Real-window tests of the inspector and the settings editor (need a display; see
 * {@link FxWindowTestBase}): a refused value shown beside its field, undo back to the saved layout,
 * the receiver editor, and Assign slots with the frame in the status bar. They use the small relay
 * chain so each plan takes a moment. With {@code -Dnanoplan.screenshots=DIR} each test also writes
 * a PNG of the window there, to look at.
 */
@Timeout(value = 120, unit = TimeUnit.SECONDS)
class InspectorWindowTest extends FxWindowTestBase {

    static final Path RELAYED = Path.of("..", "scenarios", "relay-chain-relayed.json");

    Window open(Path file) throws Exception {
        bg = PlannerViewModel.daemonScheduler();
        Window w = onFx(() -> {
            Window shown = showMainWindow(null);
            assertThat(shown.vm().open(file)).isTrue();
            return shown;
        });
        w.vm().plans().planned().get(100, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        return w;
    }

    <T> T find(String id, Class<T> type) {
        return type.cast(stage.getScene().lookup("#" + id));
    }

    /** The shown label whose text is {@code text}, or null. */
    static Label shownLabel(Parent root, String text) {
        for (javafx.scene.Node n : root.getChildrenUnmodifiable()) {
            if (n instanceof Label l && text.equals(l.getText()) && l.isVisible()) {
                return l;
            }
            if (n instanceof Parent p) {
                Label inner = shownLabel(p, text);
                if (inner != null) {
                    return inner;
                }
            }
        }
        return null;
    }

    void screenshot(String name) throws Exception {
        String dir = System.getProperty("nanoplan.screenshots");
        if (dir != null) {
            Files.createDirectories(Path.of(dir));
            onFx(() -> {
                Snapshots.writePng(stage.getScene().snapshot(null), Path.of(dir, name + ".png"));
                return null;
            });
        }
    }

    @Test
    void aRefusedSettingIsShownUnderItsFieldNamedAsInTheFile() throws Exception {
        Window w = open(RELAYED);
        onFx(() -> {
            w.view().showTab("Settings");
            return null;
        });
        WaitForAsyncUtils.waitForFxEvents();
        String message = "signalling.symbol_time_s must be finite and > 0, got -3.0";
        onFx(() -> {
            TextField t = find("settings-symbol-time", TextField.class);
            t.setText("-3");
            find("apply-settings", Button.class).fire();
            assertThat(t.getStyleClass()).contains(Widgets.FIELD_ERROR);
            Label beside = shownLabel(stage.getScene().getRoot(), message);
            assertThat(beside).isNotNull();
            // the message sits under the field, in the same grid
            assertThat(beside.getParent()).isSameAs(t.getParent());
            assertThat(w.vm().messageProperty().get()).contains(message);
            return null;
        });
        WaitForAsyncUtils.waitForFxEvents();
        screenshot("settings-error");
        onFx(() -> {
            find("settings-symbol-time", TextField.class).setText("1");
            find("apply-settings", Button.class).fire();
            assertThat(find("settings-symbol-time", TextField.class).getStyleClass()).doesNotContain(Widgets.FIELD_ERROR);
            assertThat(shownLabel(stage.getScene().getRoot(), message)).isNull();
            return null;
        });
    }

    @Test
    void undoingBackToTheOpenedLayoutClearsTheUnsavedMarkInTheTitle() throws Exception {
        Window w = open(RELAYED);
        onFx(() -> {
            w.vm().editor().selectedNodeIdProperty().set("relay1");
            TextField radius = find("inspector-radius", TextField.class);
            radius.setText(Double.toString(w.vm().editor().nodeById("relay1").radiusUm() * 1.1));
            find("apply-node", Button.class).fire();
            assertThat(w.vm().document().titleProperty().get()).startsWith("• ");
            w.vm().undo();
            assertThat(w.vm().document().titleProperty().get()).doesNotStartWith("•");
            w.vm().redo();
            assertThat(w.vm().document().titleProperty().get()).startsWith("• ");
            return null;
        });
    }

    @Test
    @SuppressWarnings("unchecked")
    void choosingAPassiveReceiverShowsItsSamplingOffsetAndAppliesIt() throws Exception {
        Window w = open(RELAYED);
        onFx(() -> {
            w.vm().editor().selectedNodeIdProperty().set("dst");
            ChoiceBox<ReceiverModel.Kind> receiver = find("inspector-receiver", ChoiceBox.class);
            assertThat(receiver.isDisabled()).isFalse();
            receiver.setValue(ReceiverModel.Kind.PASSIVE);
            assertThat(find("inspector-sampling-offset", TextField.class).isVisible()).isTrue();
            assertThat(find("inspector-binding-rate", TextField.class).isVisible()).isFalse();
            find("inspector-sampling-offset", TextField.class).setText("0.5");
            find("apply-node", Button.class).fire();
            Node dst = w.vm().editor().nodeById("dst");
            assertThat(dst.receiver()).isEqualTo(ReceiverModel.passive(0.5));
            // a transmitter has no receiver model: the choice is disabled
            w.vm().editor().selectedNodeIdProperty().set("src");
            assertThat(receiver.isDisabled()).isTrue();
            w.vm().editor().selectedNodeIdProperty().set("dst");
            return null;
        });
        WaitForAsyncUtils.waitForFxEvents();
        screenshot("inspector-passive");
        onFx(() -> {
            find("inspector-sampling-offset", TextField.class).setText("-1");
            find("apply-node", Button.class).fire();
            int index = w.vm().scenarioProperty().get().nodes().indexOf(w.vm().editor().nodeById("dst"));
            assertThat(shownLabel(stage.getScene().getRoot(),
                    "nodes[" + index + "].sampling_offset_s must be finite and > 0, got -1.0")).isNotNull();
            assertThat(find("inspector-sampling-offset", TextField.class).getStyleClass()).contains(Widgets.FIELD_ERROR);
            return null;
        });
        screenshot("inspector-passive-error");
    }

    @Test
    void assignSlotsIsOneUndoableStepAndTheStatusBarShowsTheFrame() throws Exception {
        Window w = open(RELAYED);
        onFx(() -> {
            assertThat(find("slot-frame", Label.class).isVisible()).isFalse();
            find("assign-slots", Button.class).fire();
            return null;
        });
        w.vm().slots().finished().get(100, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        onFx(() -> {
            assertThat(w.vm().scenarioProperty().get().signalling().schedule()).isEqualTo(Schedule.SLOTS);
            Label frame = find("slot-frame", Label.class);
            assertThat(frame.isVisible()).isTrue();
            assertThat(frame.getText()).matches("frame \\d+ slots?.*");
            w.vm().editor().selectedNodeIdProperty().set("src");
            TextField slot = find("inspector-slot", TextField.class);
            assertThat(slot.isVisible()).isTrue();
            assertThat(slot.getText()).isEqualTo(
                    w.vm().scenarioProperty().get().signalling().slots().get("src").toString());
            return null;
        });
        screenshot("assign-slots");
        onFx(() -> {
            assertThat(w.vm().undo()).isTrue();
            assertThat(w.vm().scenarioProperty().get().signalling().schedule()).isEqualTo(Schedule.ALL_ACTIVE);
            assertThat(find("slot-frame", Label.class).isVisible()).isFalse();
            assertThat(find("inspector-slot", TextField.class).isVisible()).isFalse();
            assertThat(w.vm().document().dirtyProperty().get()).isFalse();
            return null;
        });
    }

    @Test
    void theAboutDialogIsDarkLikeTheWindow() throws Exception {
        Window w = open(RELAYED);
        double[] luminance = onFx(() -> {
            Alert about = new AppActions(stage, w.vm()).aboutDialog();
            about.show();
            try {
                javafx.scene.image.Image shot = about.getDialogPane().snapshot(null, null);
                // the pane's background just inside its top-left corner and the text area's background
                javafx.scene.paint.Color header = shot.getPixelReader().getColor(4, 4);
                javafx.scene.paint.Color body = shot.getPixelReader().getColor((int) shot.getWidth() / 2,
                        (int) shot.getHeight() / 2);
                if (System.getProperty("nanoplan.screenshots") != null) {
                    Snapshots.writePng(shot, Path.of(System.getProperty("nanoplan.screenshots"), "about.png"));
                }
                return new double[] {header.getBrightness(), body.getBrightness()};
            } finally {
                about.close();
            }
        });
        // dark theme (nanoplan.css: -np-panel #222b37, -fx-control-inner-background #1f2833): brightness < 0.3,
        // where Modena's default light dialog is about 0.9
        assertThat(luminance[0]).isLessThan(0.3);
        assertThat(luminance[1]).isLessThan(0.3);
    }
}
