import { DataTypes } from 'sequelize'
import type { Migration } from './index'

// The outbox: every mail the local SMTP catcher receives, filed under the studio it was sent for.
// A studio's mail goes when the studio goes; mail sent for no studio (a password reset) has none.
const migration: Migration = {
  name: '0003-mail',
  async up({ queryInterface: q, transaction }) {
    await q.createTable('mails', {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      studio_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      message_id: { type: DataTypes.STRING(998), allowNull: true },
      from: { type: DataTypes.TEXT, allowNull: false },
      to: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: true },
      text: { type: DataTypes.TEXT, allowNull: true },
      received_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction })
    // Serves the outbox list: one studio's mail, newest first.
    await q.addIndex('mails', ['studio_id', 'received_at'], { name: 'mails_studio_id_received_at', transaction })
  },
  async down({ queryInterface: q, transaction }) {
    await q.dropTable('mails', { transaction })
  },
}

export default migration
