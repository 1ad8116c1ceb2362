package dev.nanoplan.desktop;

import static dev.nanoplan.desktop.Widgets.button;
import static dev.nanoplan.desktop.Widgets.errorLabel;
import static dev.nanoplan.desktop.Widgets.field;
import static dev.nanoplan.desktop.Widgets.fieldRow;
import static dev.nanoplan.desktop.Widgets.outline;
import static dev.nanoplan.desktop.Widgets.grid;
import static dev.nanoplan.desktop.Widgets.section;
import static dev.nanoplan.desktop.Widgets.smallField;

import dev.nanoplan.count.CountModelKind;
import dev.nanoplan.scenario.Schedule;
import java.util.List;
import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.Separator;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.ColumnConstraints;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.util.StringConverter;

/**
 * The Settings tab (a View): medium (with bulk flow), signalling (with the slot schedule) and
 * species of the whole layout, bound to {@link ScenarioSettings}; species can be added, renamed and
 * removed. Apply makes it one undoable edit through {@link PlannerViewModel#applySettings()}.
 */
final class SettingsPane {

    private final PlannerViewModel vm;
    private final Region node;

    SettingsPane(PlannerViewModel vm) {
        this.vm = vm;
        this.node = build();
    }

    /**
     * Medium (with bulk flow), signalling (with the slot schedule) and species settings of the whole
     * layout; species can be added, renamed and removed. Apply makes it one undoable edit.
     */
    /** The pane: medium, signalling and species sections with Apply and Revert. */
    Region node() {
        return node;
    }

    private Region build() {
        ScenarioSettings st = vm.settings();
        GridPane medium = grid();
        int row = 0;
        FieldErrors errors = st.errors();
        row = fieldRow(medium, row, new Label("temperature K"), field(st.temperatureKProperty(), "settings-temperature"),
                errors.message(ScenarioSettings.TEMPERATURE));
        row = fieldRow(medium, row, new Label("viscosity mPa·s"), field(st.viscosityMPaSProperty(), "settings-viscosity"),
                errors.message(ScenarioSettings.VISCOSITY));
        row = fieldRow(medium, row, new Label("background molecules/s"),
                field(st.backgroundMoleculesPerSProperty(), "settings-background"),
                errors.message(ScenarioSettings.BACKGROUND));
        ChoiceBox<String> flow = new ChoiceBox<>();
        flow.getItems().addAll(ScenarioSettings.FLOW_PROFILES);
        flow.valueProperty().bindBidirectional(st.flowProfileProperty());
        flow.setId("flow-profile");
        flow.setTooltip(new Tooltip("Bulk flow of the medium: none (still fluid), uniform (the same drift "
                + "everywhere) or poiseuille (laminar flow along +x, cylinder volumes only)"));
        row = fieldRow(medium, row, new Label("flow"), flow, errors.message("medium.flow.profile"));
        HBox velocity = new HBox(4);
        var components = List.of(st.flowVxUmPerSProperty(), st.flowVyUmPerSProperty(), st.flowVzUmPerSProperty());
        for (int i = 0; i < components.size(); i++) {
            TextField c = smallField(components.get(i), "0");
            c.setPrefColumnCount(3);
            outline(c, errors.message(ScenarioSettings.VELOCITY + "[" + i + "]"));
            velocity.getChildren().add(c);
        }
        Label velocityLabel = new Label("velocity µm/s (x, y, z)");
        showWhen(st, ScenarioSettings.FLOW_PROFILES.get(1), velocityLabel, velocity);
        // the uniform and the poiseuille fields share one row: only one of them is shown
        medium.addRow(row, velocityLabel, velocity);
        medium.add(errorLabel(errors.messageUnder(ScenarioSettings.VELOCITY)), 0, row + 1, 2, 1);
        TextField meanSpeed = field(st.flowMeanSpeedUmPerSProperty());
        meanSpeed.setTooltip(new Tooltip("Mean speed over the cross-section; the speed on the axis is twice this "
                + "and zero at the wall (Hagen–Poiseuille)"));
        Label meanSpeedLabel = new Label("mean speed µm/s");
        showWhen(st, ScenarioSettings.FLOW_PROFILES.get(2), meanSpeedLabel, meanSpeed);
        row = fieldRow(medium, row, meanSpeedLabel, meanSpeed, errors.message(ScenarioSettings.MEAN_SPEED));

        GridPane signalling = grid();
        // the medium and signalling fields line up in one column
        for (GridPane g : List.of(medium, signalling)) {
            ColumnConstraints labels = new ColumnConstraints();
            labels.setMinWidth(150);
            g.getColumnConstraints().add(labels);
        }
        row = 0;
        row = fieldRow(signalling, row, new Label("symbol time s"), field(st.symbolTimeSProperty(), "settings-symbol-time"),
                errors.message(ScenarioSettings.SYMBOL_TIME));
        row = fieldRow(signalling, row, new Label("ISI memory symbols"),
                field(st.isiMemorySymbolsProperty(), "settings-isi-memory"), errors.message(ScenarioSettings.ISI_MEMORY));
        row = fieldRow(signalling, row, new Label("levels"), field(st.levelsProperty(), "settings-levels"),
                errors.message(ScenarioSettings.LEVELS));
        row = fieldRow(signalling, row, new Label("prior one"), field(st.priorOneProperty(), "settings-prior-one"),
                errors.message(ScenarioSettings.PRIOR_ONE));
        ChoiceBox<CountModelKind> count = new ChoiceBox<>();
        count.getItems().addAll(CountModelKind.values());
        count.setConverter(new StringConverter<>() {
            @Override
            public String toString(CountModelKind k) {
                return k == null ? "" : k.id();
            }

            @Override
            public CountModelKind fromString(String text) {
                return CountModelKind.parse(text);
            }
        });
        count.valueProperty().bindBidirectional(st.countModelProperty());
        signalling.addRow(row++, new Label("count model"), count);
        ChoiceBox<Schedule> schedule = new ChoiceBox<>();
        schedule.getItems().addAll(Schedule.values());
        schedule.setConverter(new StringConverter<>() {
            @Override
            public String toString(Schedule k) {
                return k == null ? "" : k.id();
            }

            @Override
            public Schedule fromString(String text) {
                return Schedule.parse(text);
            }
        });
        schedule.valueProperty().bindBidirectional(st.scheduleProperty());
        schedule.setId("schedule");
        Tooltip scheduleTip = new Tooltip(ScenarioSettings.SCHEDULE_HELP);
        scheduleTip.setWrapText(true);
        scheduleTip.setMaxWidth(360);
        schedule.setTooltip(scheduleTip);
        Label scheduleLabel = new Label("schedule");
        scheduleLabel.setTooltip(scheduleTip);
        signalling.addRow(row++, scheduleLabel, schedule);

        GridPane species = grid();
        species.setId("species-grid");
        Runnable fillSpecies = () -> {
            species.getChildren().clear();
            species.addRow(0, new Label("name"), new Label("D µm²/s"), new Label("radius nm"),
                    new Label("half-life s"), new Label("used by"));
            int r = 1;
            int i = 0;
            for (SpeciesRow sp : st.species()) {
                String at = "species[" + i + "]";
                TextField name = smallField(sp.nameProperty(), "name");
                name.setTooltip(new Tooltip("Renaming renames the species in every node on Apply"));
                name.setId("species-name-" + i);
                TextField d = smallField(sp.diffusionUm2PerSProperty(), "D");
                d.setPrefColumnCount(6);
                d.setTooltip(new Tooltip("Diffusion coefficient; give this or the hydrodynamic radius"));
                d.setId("species-d-" + i);
                TextField radius = smallField(sp.hydrodynamicRadiusNmProperty(), "—");
                radius.setTooltip(new Tooltip("Hydrodynamic radius: D then follows from Stokes–Einstein, "
                        + "D = kT/(6πηr), at the medium's temperature and viscosity"));
                TextField half = smallField(sp.halfLifeSProperty(), "stable");
                Label used = new Label();
                used.textProperty().bind(sp.usageProperty());
                used.getStyleClass().add("hint");
                if (!sp.usedBy().isEmpty()) {
                    used.setTooltip(new Tooltip(String.join(", ", sp.usedBy())));
                }
                Button remove = button("−", "Remove this species on Apply (refused while nodes use it)",
                        () -> vm.removeSpecies(sp));
                remove.setId("remove-species-" + i);
                outline(name, errors.message(at + ".name"));
                outline(d, errors.message(at + ".diffusion_um2_per_s"));
                outline(radius, errors.message(at + ".hydrodynamic_radius_nm"));
                outline(half, errors.message(at + ".half_life_s"));
                species.addRow(r, name, d, radius, half, used, remove);
                Label rowError = errorLabel(errors.messageUnder(at + "."));
                rowError.setId("species-error-" + i);
                species.add(rowError, 0, r + 1, 6, 1);
                r += 2;
                i++;
            }
        };
        fillSpecies.run();
        st.species().addListener((ListChangeListener<SpeciesRow>) c -> fillSpecies.run());
        Button addSpecies = button("+ Species", "Add a species row: give a name and a diffusion coefficient or "
                + "a hydrodynamic radius, then Apply", st::addSpecies);
        addSpecies.setId("add-species");
        addSpecies.disableProperty().bind(vm.scenarioProperty().isNull());

        Button apply = button("Apply", "Apply these settings to the layout (undoable); the plan is recomputed",
                vm::applySettings);
        apply.disableProperty().bind(vm.scenarioProperty().isNull());
        apply.setId("apply-settings");
        Button revert = button("Revert", "Show the layout's current settings again",
                () -> st.load(vm.scenarioProperty().get(), vm.document().unusedSpecies()));
        revert.disableProperty().bind(vm.scenarioProperty().isNull());
        Label hint = new Label("Give each species a diffusion coefficient or a hydrodynamic radius; half-life "
                + "blank = stable. A species no node uses yet is kept here and offered in the inspector, but is "
                + "not saved until a node uses it.");
        hint.getStyleClass().add("hint");
        hint.setWrapText(true);
        VBox box = new VBox(8, section("Medium"), medium, new Separator(), section("Signalling"), signalling,
                new Separator(), section("Species"), species, addSpecies, hint, new Separator(),
                new HBox(6, apply, revert));
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        ScrollPane scroll = new ScrollPane(box);
        scroll.setFitToWidth(true);
        scroll.getStyleClass().add("inspector");
        return scroll;
    }

    /** Shows (and lays out) the nodes only while the flow profile is {@code profile}. */
    private static void showWhen(ScenarioSettings st, String profile, Node... nodes) {
        for (Node n : nodes) {
            n.visibleProperty().bind(st.flowProfileProperty().isEqualTo(profile));
            n.managedProperty().bind(n.visibleProperty());
        }
    }
}
